import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import { simulatedGroupsSchema, type SimulatedGroupsInput } from "@shared/schemas/class-runs";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/text-field";
import { useAddSimulatedGroups } from "../api/add-simulated-groups";

/** The virtual class: simulated groups from the engine's seeded simulation, marked simulated everywhere. */
export function VirtualClassForm({ runId }: { runId: string }) {
  const add = useAddSimulatedGroups(runId);
  const { register, handleSubmit, formState } = useForm<SimulatedGroupsInput>({
    resolver: zodResolver(simulatedGroupsSchema),
    defaultValues: { groups: 4, rollsPerGroup: 250 },
  });
  return (
    <form
      noValidate
      onSubmit={handleSubmit((values) => add.mutate({ runId, ...values }))}
      className="flex flex-col gap-3"
      aria-label="Add simulated groups"
    >
      <p className="text-ink-soft">
        No dice in the room, or want to see thousands of rolls? Simulated groups roll the same dice by computer (a seeded simulation). They
        are marked “Simulated”, and the board can show the class’s own rolls without them.
      </p>
      <div className="grid gap-3 sm:grid-cols-3">
        <TextField
          label="Groups"
          type="number"
          min={1}
          max={20}
          {...register("groups", { valueAsNumber: true })}
          error={formState.errors.groups?.message}
        />
        <TextField
          label="Rolls per group"
          type="number"
          min={1}
          max={5000}
          {...register("rollsPerGroup", { valueAsNumber: true })}
          error={formState.errors.rollsPerGroup?.message}
        />
        <TextField
          label="Seed (optional)"
          hint="The same seed gives the same rolls."
          type="number"
          {...register("seed", { setValueAs: (value) => (value === "" || value === undefined ? undefined : Number(value)) })}
          error={formState.errors.seed?.message}
        />
      </div>
      {add.error && <Alert tone="error">{add.error.message}</Alert>}
      {add.data && (
        <Alert tone="info">
          Added {add.data.groups.length} simulated groups with {add.data.rolls} rolls (seed {add.data.seed}).
        </Alert>
      )}
      <Button type="submit" variant="secondary" busy={add.isPending} className="self-start">
        Add simulated groups
      </Button>
    </form>
  );
}
