/** The audit trail: appended, never changed. */
import type { Db } from '@db/connection';
import type { Transaction } from 'sequelize';

export interface AuditInput {
  organizationId: number;
  actorId: string | null;
  action: string;
  subjectType: 'plan' | 'user' | 'organization';
  subjectId: string | number;
  details?: Record<string, unknown>;
}

export interface AuditEntry {
  id: number;
  actorId: string | null;
  actorName: string | null;
  action: string;
  subjectType: string;
  subjectId: string;
  details: Record<string, unknown> | null;
  at: Date;
}

export async function recordEvent(db: Db, input: AuditInput, transaction?: Transaction): Promise<void> {
  await db.models.AuditEvent.create(
    {
      organizationId: input.organizationId,
      actorId: input.actorId,
      action: input.action,
      subjectType: input.subjectType,
      subjectId: String(input.subjectId),
      details: input.details ? JSON.stringify(input.details) : null,
    },
    { transaction },
  );
}

export async function listEvents(db: Db, organizationId: number, subjectType: string, subjectId: string | number): Promise<AuditEntry[]> {
  const rows = await db.models.AuditEvent.findAll({
    where: { organizationId, subjectType, subjectId: String(subjectId) },
    order: [['at', 'DESC'], ['id', 'DESC']],
    limit: 500,
  });
  const actorIds = [...new Set(rows.map((r) => r.actorId).filter((x): x is string => !!x))];
  const actors = actorIds.length ? await db.models.User.findAll({ where: { id: actorIds }, attributes: ['id', 'name'] }) : [];
  const names = new Map(actors.map((a) => [a.id, a.name]));
  return rows.map((r) => ({
    id: Number(r.id),
    actorId: r.actorId,
    actorName: r.actorId ? names.get(r.actorId) ?? null : null,
    action: r.action,
    subjectType: r.subjectType,
    subjectId: r.subjectId,
    details: r.details ? JSON.parse(r.details) : null,
    at: r.at,
  }));
}
