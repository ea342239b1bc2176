import { and, eq, gt, isNull } from 'drizzle-orm';
import express, { type Router } from 'express';
import { acceptInvitationBodySchema, invitationTokenSchema } from '@seamwright/api';
import type { AppContext } from '../app-context';
import { currentUser, requireUser } from '../auth/sessions';
import { hashToken } from '../auth/tokens';
import { HttpError } from '../http/errors';
import { parseOr400 } from '../http/validate';
import { ownerName, patternJson } from '../services/revisions';
import type { Data } from '../db/data';


const invalid = () => new HttpError(404, 'This invitation is invalid, used, revoked or expired');

async function liveInvitation(d: Data, token: string) {
  const { invitations, patterns, users } = d.t;
  const [found] = await d.db
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
    );
  return found;
}

/** `/api/invitations…`: preview and accept an invitation by its e-mailed token. */
export function invitationsRouter(ctx: AppContext): Router {
  const d = ctx.data;
  const router = express.Router();

  router.get('/:token', async (req, res) => {
    const token = invitationTokenSchema.safeParse(req.params.token);
    const found = token.success ? await liveInvitation(d, token.data) : undefined;
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

  router.post('/accept', requireUser, async (req, res) => {
    const user = currentUser(req);
    const body = parseOr400(acceptInvitationBodySchema, req.body);
    const result = await d.transaction(async (tx) => {
      const { invitations, members } = tx.t;
      const found = await liveInvitation(tx, body.token);
      if (!found) throw invalid();
      if (found.invitation.email !== user.email) {
        throw new HttpError(403, `This invitation was sent to ${found.invitation.email}; sign in with that address to accept it`);
      }
      // Used once: when another acceptance (on any instance) got there first, this update changes nothing.
      const used = await tx.db
        .update(invitations)
        .set({ acceptedAt: new Date(), acceptedBy: user.id })
        .where(and(eq(invitations.id, found.invitation.id), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
        .returning({ id: invitations.id });
      if (used.length === 0) throw invalid();
      if (found.pattern.ownerId !== user.id) {
        await tx.db
          .insert(members)
          .values({ patternId: found.pattern.id, userId: user.id, access: found.invitation.access, createdAt: new Date() })
          .onConflictDoUpdate({ target: [members.patternId, members.userId], set: { access: found.invitation.access } });
      }
      return { pattern: found.pattern, access: found.pattern.ownerId === user.id ? ('owner' as const) : found.invitation.access };
    });
    res.json({ pattern: patternJson(result.pattern, await ownerName(d, result.pattern.ownerId), result.access) });
  });

  return router;
}
