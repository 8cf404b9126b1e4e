import { DiceSetList } from "@/features/dice-bench/components/dice-set-list";

export function DiceBenchListRoute() {
  return <DiceSetList />;
}
