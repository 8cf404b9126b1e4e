import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import {
  approveProposalSchema,
  declineProposalSchema,
  type ApproveProposalInput,
  type DeclineProposalInput,
  type ShelfProposal,
} from "@shared/schemas/shelf";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { SelectField } from "@/components/ui/select-field";
import { TextArea } from "@/components/ui/text-area";
import { useApproveProposal } from "../api/approve-proposal";
import { useDeclineProposal } from "../api/decline-proposal";
import { useTemplates } from "../api/list-templates";

type ApproveValues = { target: "new" | "version" | null; templateId: string; changeNote: string };

/**
 * The head's decision on one proposal: publish it (new template or next version of one) or decline it with a note.
 * Nothing is chosen beforehand: the head picks Approve or Decline, and for an approval what it becomes.
 */
export function ProposalDecision({ proposal }: { proposal: ShelfProposal }) {
  const [mode, setMode] = useState<"approve" | "decline" | null>(null);
  const templates = useTemplates("published");
  const approve = useApproveProposal();
  const decline = useDeclineProposal();
  const approveForm = useForm<ApproveValues>({
    resolver: zodResolver(approveProposalSchema) as never,
    defaultValues: { target: null, templateId: "", changeNote: "" },
  });
  const declineForm = useForm<DeclineProposalInput>({ resolver: zodResolver(declineProposalSchema), defaultValues: { note: "" } });
  const target = approveForm.watch("target");
  const templateOptions = [
    { value: "", label: "Choose a template" },
    ...(templates.data?.templates ?? []).map((template) => ({
      value: template.id,
      label: `${template.title} (now version ${template.currentVersion})`,
    })),
  ];
  const approveErrors = approveForm.formState.errors;

  return (
    <div className="flex flex-col gap-4">
      <ChoiceGroup<"approve" | "decline">
        legend="Your decision"
        hint={mode === null ? "Choose one to go on; nothing is decided until you press its button." : undefined}
        value={mode}
        onChange={setMode}
        options={[
          { value: "approve", label: "Approve" },
          { value: "decline", label: "Decline" },
        ]}
      />
      {mode === "approve" && (
        <form
          noValidate
          aria-label={`Approve “${proposal.lessonTitle ?? "lesson"}”`}
          className="flex flex-col gap-4"
          onSubmit={approveForm.handleSubmit((values) =>
            approve.mutate({ proposalId: proposal.id, input: values as ApproveProposalInput }),
          )}
        >
          {approve.error && (
            <Alert tone="error" title="Not approved">
              {approve.error.message}
            </Alert>
          )}
          <ChoiceGroup<"new" | "version">
            legend="Publish it as"
            value={target}
            error={(approveErrors as { target?: { message?: string } }).target?.message}
            onChange={(value) => approveForm.setValue("target", value, { shouldValidate: approveForm.formState.isSubmitted })}
            options={[
              { value: "new", label: "A new template" },
              { value: "version", label: "The next version of a template" },
            ]}
          />
          {target === "version" && (
            <SelectField
              label="Template it updates"
              options={templateOptions}
              {...approveForm.register("templateId")}
              error={(approveErrors as { templateId?: { message?: string } }).templateId?.message}
            />
          )}
          <TextArea
            label="Change note"
            rows={2}
            placeholder={target === "version" ? "What this version changes" : "e.g. First version, from Tomasz's 9M lesson"}
            {...approveForm.register("changeNote")}
            error={approveErrors.changeNote?.message}
          />
          <div>
            <Button type="submit" busy={approve.isPending}>
              Approve and publish
            </Button>
          </div>
        </form>
      )}
      {mode === "decline" && (
        <form
          noValidate
          aria-label={`Decline “${proposal.lessonTitle ?? "lesson"}”`}
          className="flex flex-col gap-4"
          onSubmit={declineForm.handleSubmit((values) => decline.mutate({ proposalId: proposal.id, input: values }))}
        >
          {decline.error && (
            <Alert tone="error" title="Not declined">
              {decline.error.message}
            </Alert>
          )}
          <TextArea
            label="Why, for the teacher"
            rows={2}
            placeholder="e.g. Add a Prove phase and it can go on the shelf"
            {...declineForm.register("note")}
            error={declineForm.formState.errors.note?.message}
          />
          <div>
            <Button type="submit" variant="danger" busy={decline.isPending}>
              Decline
            </Button>
          </div>
        </form>
      )}
    </div>
  );
}
