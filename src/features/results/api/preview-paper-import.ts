import { useMutation } from "@tanstack/react-query";
import type { PaperImportResult } from "@shared/schemas/results";
import { api } from "@/lib/api-client";

export type PaperImportRequest = { runId: string; file: File; createGroups: boolean; tally: number };

/** The multipart body both Paper import requests send: the file, the "create groups" choice and the tally. */
export function paperImportForm({ file, createGroups, tally }: PaperImportRequest) {
  const body = new FormData();
  body.set("createGroups", createGroups ? "true" : "false");
  body.set("tally", String(tally));
  body.set("file", file, file.name);
  return body;
}

/** Checks a Paper import file against the run without storing anything. */
export function previewPaperImport(request: PaperImportRequest) {
  return api.post<PaperImportResult>(
    `/api/results/runs/${encodeURIComponent(request.runId)}/paper-import/preview`,
    paperImportForm(request),
  );
}

export function usePreviewPaperImport() {
  return useMutation({ mutationFn: previewPaperImport });
}
