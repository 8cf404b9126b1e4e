import { PageHeader } from "@/components/ui/page-header";
import { Alert } from "@/components/ui/alert";

/** Holds an area's place in the navigation until that area's own screens are in this build. */
export function AreaPreview({ area }: { area: { label: string; summary: string } }) {
  return (
    <>
      <PageHeader title={area.label} lead={area.summary} />
      <Alert tone="info" title="Not in this build yet">
        This area is planned and not yet available in this version of Outroll.
      </Alert>
    </>
  );
}
