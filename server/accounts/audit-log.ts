import type { Request } from 'express';
import type { Transaction } from 'sequelize';
import { AuditEvent, type AuditAction } from '../database/models/audit-event';

export interface AuditEntry {
  action: AuditAction;
  actorUserId?: number | null;
  subjectUserId?: number | null;
  email?: string | null;
  detail?: string | null;
}

/** Adds one line to the audit log, with the caller's address; long values are cut to fit, never refused. */
export async function recordAuditEvent(request: Request, entry: AuditEntry, transaction?: Transaction): Promise<void> {
  await AuditEvent.create(
    {
      action: entry.action,
      actorUserId: entry.actorUserId ?? null,
      subjectUserId: entry.subjectUserId ?? null,
      email: entry.email?.slice(0, 254) ?? null,
      ip: request.ip?.slice(0, 45) ?? null,
      detail: entry.detail?.slice(0, 500) ?? null,
    },
    { transaction },
  );
}
