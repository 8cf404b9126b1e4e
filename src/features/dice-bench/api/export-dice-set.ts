/** The address of a set's file download (GET answers the JSON file with a download file name). */
export function diceSetFileUrl(id: string) {
  return `/api/dice-sets/${encodeURIComponent(id)}/file`;
}
