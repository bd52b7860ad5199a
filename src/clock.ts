/** The current time as an ISO-8601 UTC string, the form every stored time takes. */
export function nowIso(): string {
  return new Date().toISOString();
}
