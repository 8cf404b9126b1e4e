import { useState } from "react";
import { useNavigate } from "react-router-dom";
import type { TemplateStatus } from "@shared/schemas/shelf";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { usePublishTemplate } from "../api/publish-template";
import { useTemplates } from "../api/list-templates";
import { PublishLessonForm } from "./publish-lesson-form";
import { TemplateList } from "./template-list";

/** The shelf's front page: the templates on show; the head of department also publishes here and sees retired ones. */
export function ShelfTemplatesPanel({ isHead }: { isHead: boolean }) {
  const navigate = useNavigate();
  const [status, setStatus] = useState<TemplateStatus>("published");
  const [publishing, setPublishing] = useState(false);
  const templates = useTemplates(isHead ? status : "published");
  const publish = usePublishTemplate();

  return (
    <div className="flex flex-col gap-6">
      {isHead && (
        <section aria-labelledby="publish-heading" className="rounded-2xl border-2 border-line bg-shell p-5">
          <div className="flex flex-wrap items-center justify-between gap-3">
            <h2 id="publish-heading" className="text-2xl">
              Publish one of your lessons
            </h2>
            <Button variant="secondary" aria-expanded={publishing} onClick={() => setPublishing((open) => !open)}>
              {publishing ? "Close" : "Publish a lesson"}
            </Button>
          </div>
          {publishing && (
            <div className="mt-4 max-w-2xl">
              <PublishLessonForm
                title="Publish a lesson as a template"
                submitLabel="Publish as version 1"
                notePlaceholder="e.g. First version, for Year 8"
                busy={publish.isPending}
                error={publish.error}
                onSubmit={(values) =>
                  publish.mutate(values, { onSuccess: (detail) => navigate(`/app/shelf/templates/${detail.template.id}`) })
                }
              />
            </div>
          )}
        </section>
      )}
      {isHead && (
        <ChoiceGroup<TemplateStatus>
          legend="Show"
          value={status}
          onChange={setStatus}
          options={[
            { value: "published", label: "On the shelf" },
            { value: "retired", label: "Retired" },
          ]}
        />
      )}
      {templates.isPending && <p role="status">Loading the shelf…</p>}
      {templates.isError && (
        <Alert tone="error" title="The shelf could not be loaded">
          {templates.error.message}
        </Alert>
      )}
      {templates.data && (
        <TemplateList
          templates={templates.data.templates}
          emptyText={
            status === "retired" && isHead
              ? "No retired templates."
              : isHead
                ? "Nothing on the shelf yet. Publish one of your lessons, or approve a teacher's proposal."
                : "Nothing on the shelf yet. Your head of department publishes templates here; you can propose one of your lessons."
          }
        />
      )}
    </div>
  );
}
