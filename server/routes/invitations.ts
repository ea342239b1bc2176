import { and, eq, gt, isNull } from 'drizzle-orm';
import express, { type Router } from 'express';
import { acceptInvitationBodySchema, invitationTokenSchema } from '@seamwright/api';
import type { AppContext } from '../app-context';
import { currentUser, requireUser } from '../auth/sessions';
import { hashToken } from '../auth/tokens';
import { invitations, members, patterns, users } from '../db/schema';
import { HttpError } from '../http/errors';
import { parseOr400 } from '../http/validate';
import { ownerName, patternJson } from '../services/revisions';
import type { DbLike } from '../db/database';


const invalid = () => new HttpError(404, 'This invitation is invalid, used, revoked or expired');

function liveInvitation(db: DbLike, token: string) {
  return db
    .select({ invitation: invitations, pattern: patterns, inviterName: users.displayName })
    .from(invitations)
    .innerJoin(patterns, eq(patterns.id, invitations.patternId))
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .where(
      and(
        eq(invitations.tokenHash, hashToken(token)),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, new Date()),
        isNull(patterns.trashedAt),
      ),
    )
    .get();
}

/** `/api/invitations…`: preview and accept an invitation by its e-mailed token. */
export function invitationsRouter(ctx: AppContext): Router {
  const { db } = ctx;
  const router = express.Router();

  router.get('/:token', (req, res) => {
    const token = invitationTokenSchema.safeParse(req.params.token);
    const found = token.success ? liveInvitation(db, token.data) : undefined;
    if (!found) throw invalid();
    res.json({
      invitation: {
        patternTitle: found.pattern.title,
        invitedBy: { displayName: found.inviterName },
        email: found.invitation.email,
        access: found.invitation.access,
        expiresAt: found.invitation.expiresAt.toISOString(),
      },
    });
  });

  router.post('/accept', requireUser, (req, res) => {
    const user = currentUser(req);
    const body = parseOr400(acceptInvitationBodySchema, req.body);
    const result = db.transaction(
      (tx) => {
        const found = liveInvitation(tx, body.token);
        if (!found) throw invalid();
        if (found.invitation.email !== user.email) {
          throw new HttpError(403, `This invitation was sent to ${found.invitation.email}; sign in with that address to accept it`);
        }
        tx.update(invitations)
          .set({ acceptedAt: new Date(), acceptedBy: user.id })
          .where(eq(invitations.id, found.invitation.id))
          .run();
        if (found.pattern.ownerId !== user.id) {
          tx.insert(members)
            .values({ patternId: found.pattern.id, userId: user.id, access: found.invitation.access, createdAt: new Date() })
            .onConflictDoUpdate({ target: [members.patternId, members.userId], set: { access: found.invitation.access } })
            .run();
        }
        return { pattern: found.pattern, access: found.pattern.ownerId === user.id ? ('owner' as const) : found.invitation.access };
      },
      { behavior: 'immediate' },
    );
    res.json({ pattern: patternJson(result.pattern, ownerName(db, result.pattern.ownerId), result.access) });
  });

  return router;
}
