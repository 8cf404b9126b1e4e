/** Directed graph on vertices 0..n-1 as adjacency lists: `successors[v]` lists the w with an edge v → w. */
export type DirectedGraph = readonly (readonly number[])[];

/** Every simple cycle found, each as its vertices starting from its smallest; `complete` is false if `limit` cut the search short. */
export interface SimpleCycles {
  cycles: number[][];
  complete: boolean;
}

/** Strongly connected components of the subgraph on vertices ≥ `start`, by Tarjan's algorithm (1972). */
function componentsFrom(graph: DirectedGraph, start: number): number[][] {
  const size = graph.length;
  const order = new Array<number>(size).fill(-1);
  const low = new Array<number>(size).fill(0);
  const onStack = new Array<boolean>(size).fill(false);
  const stack: number[] = [];
  const components: number[][] = [];
  let counter = 0;
  const visit = (vertex: number): void => {
    order[vertex] = low[vertex] = counter++;
    stack.push(vertex);
    onStack[vertex] = true;
    for (const next of graph[vertex]) {
      if (next < start) continue;
      if (order[next] < 0) {
        visit(next);
        low[vertex] = Math.min(low[vertex], low[next]);
      } else if (onStack[next]) low[vertex] = Math.min(low[vertex], order[next]);
    }
    if (low[vertex] !== order[vertex]) return;
    const component: number[] = [];
    let member: number;
    do {
      member = stack.pop()!;
      onStack[member] = false;
      component.push(member);
    } while (member !== vertex);
    components.push(component);
  };
  for (let vertex = start; vertex < size; vertex += 1) if (order[vertex] < 0) visit(vertex);
  return components;
}

/**
 * Every simple directed cycle (no repeated vertex) of a graph, by Johnson's algorithm
 * (D. B. Johnson, "Finding all the elementary circuits of a directed graph", SIAM J. Comput. 1975).
 * Self-loops are ignored; stops after `limit` cycles because a dense graph can have very many.
 */
export function simpleCycles(graph: DirectedGraph, limit = 10_000): SimpleCycles {
  const size = graph.length;
  // Search one past the limit so "exactly limit cycles" still counts as complete.
  const cap = limit + 1;
  const cycles: number[][] = [];
  const blocked = new Array<boolean>(size).fill(false);
  const blockedBy: Set<number>[] = Array.from({ length: size }, () => new Set<number>());
  const path: number[] = [];
  const unblock = (vertex: number): void => {
    blocked[vertex] = false;
    for (const waiting of blockedBy[vertex]) if (blocked[waiting]) unblock(waiting);
    blockedBy[vertex].clear();
  };
  let start = 0;
  while (start < size && cycles.length < cap) {
    const components = componentsFrom(graph, start).filter((component) => component.length > 1);
    if (components.length === 0) break;
    const least = Math.min(...components.map((component) => Math.min(...component)));
    const members = new Set(components.find((component) => component.includes(least))!);
    const circuit = (vertex: number): boolean => {
      let found = false;
      path.push(vertex);
      blocked[vertex] = true;
      for (const next of graph[vertex]) {
        if (!members.has(next) || cycles.length >= cap) continue;
        if (next === least) {
          cycles.push([...path]);
          found = true;
        } else if (!blocked[next] && circuit(next)) found = true;
      }
      if (found) unblock(vertex);
      else for (const next of graph[vertex]) if (members.has(next)) blockedBy[next].add(vertex);
      path.pop();
      return found;
    };
    for (const member of members) {
      blocked[member] = false;
      blockedBy[member].clear();
    }
    circuit(least);
    start = least + 1;
  }
  return { cycles: cycles.slice(0, limit), complete: cycles.length <= limit };
}
