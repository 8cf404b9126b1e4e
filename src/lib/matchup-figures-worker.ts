// Works out large tree diagrams off the page's thread, so typing and scrolling stay smooth (see use-grouped-tree.ts).
import { groupedTreeDiagram } from "@shared/probability/grouped-tree";

export interface GroupedTreeRequest {
  id: number;
  first: number[];
  second: number[];
  dicePerPlayer: number;
}

// The worker's global scope, typed by hand: the project compiles against the DOM library, not the webworker one.
const scope = self as unknown as {
  addEventListener(type: "message", listener: (event: MessageEvent<GroupedTreeRequest>) => void): void;
  postMessage(message: unknown): void;
};
scope.addEventListener("message", (event: MessageEvent<GroupedTreeRequest>) => {
  const { id, first, second, dicePerPlayer } = event.data;
  try {
    scope.postMessage({ id, tree: groupedTreeDiagram(first, second, { dicePerPlayer }) });
  } catch (error) {
    scope.postMessage({ id, error: error instanceof Error ? error.message : String(error) });
  }
});
