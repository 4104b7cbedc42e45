/** Appends one admin action to the audit trail. */
export function audit(actorId: string, action: string, target: string | null, data: Record<string, unknown> = {}): void {
  useDB().insert(schema.auditLog).values({ actorId, action, target, data }).run()
}
