import type { Request } from 'express';
import type { AuditEntryInput } from './repository';

/** Who is acting, for the audit log: the signed-in user, where they came from, the request id. */
export function actorOf(
  req: Request,
): Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'> {
  return {
    actorUserId: req.currentUser?.id ?? null,
    actorLabel: req.currentUser?.displayName ?? null,
    ip: req.ip,
    requestId: req.id ? String(req.id) : undefined,
  };
}
