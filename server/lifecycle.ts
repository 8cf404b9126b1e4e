/** Whether this process is stopping: /api/ready answers 503 so the proxy sends new work elsewhere. */
let draining = false;

export function startDraining() {
  draining = true;
}

export function isDraining() {
  return draining;
}
