import { Alert } from "@/components/ui/alert";

/** The teacher's reminder of what Outroll keeps about pupils, and for how long. */
export function PupilDataNote() {
  return (
    <Alert tone="caution" title="What Outroll keeps about pupils">
      Only each group&rsquo;s nickname and its rolls, never names or e-mail addresses. They stay until you delete the run. Keep
      pupils&rsquo; real names out of nicknames and out of the files you upload with Paper import.
    </Alert>
  );
}
