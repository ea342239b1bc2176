import { and, eq, gt, isNull } from 'drizzle-orm';
import express, { type Router } from 'express';
import { invitationBodySchema, memberAccessBodySchema } from '@seamwright/api';
import type { AppContext } from '../app-context';
import { currentUser } from '../auth/sessions';
import { hashToken, newId, randomToken } from '../auth/tokens';
import type { invitations } from '../db/schema';
import { HttpError } from '../http/errors';
import { idSchema, parseOr400 } from '../http/validate';
import { patternOf } from '../http/pattern-access';
import { isShopBuyer, seesAddresses } from '../services/access';
import { invitationMail } from '../services/mail-templates';


/** `/api/patterns/:id/members` and `/api/patterns/:id/invitations`: sharing a pattern. */
export function membersRouter(ctx: AppContext): Router {
  const { data, config } = ctx;
  const { db } = data;
  const { invitations, members, users } = data.t;
  const router = express.Router({ mergeParams: true });

  router.get('/members', async (req, res) => {
    const found = patternOf(res);
    const { pattern, access } = found;
    const user = currentUser(req);
    const addresses = seesAddresses(access);
    // A shop buyer sees the owner and themselves only: buyers never learn about each other.
    const buyer = await isShopBuyer(data, found, user.id);
    const [owner] = await db.select().from(users).where(eq(users.id, pattern.ownerId));
    const rows = await db
      .select({ m: members, email: users.email, displayName: users.displayName })
      .from(members)
      .innerJoin(users, eq(users.id, members.userId))
      .where(and(eq(members.patternId, pattern.id), buyer ? eq(members.userId, user.id) : undefined))
      .orderBy(members.createdAt);
    const pending =
      access === 'owner'
        ? await db
            .select()
            .from(invitations)
            .where(
              and(
                eq(invitations.patternId, pattern.id),
                isNull(invitations.acceptedAt),
                isNull(invitations.revokedAt),
                gt(invitations.expiresAt, new Date()),
              ),
            )
        : [];
    res.json({
      owner: owner ? { id: owner.id, ...(addresses ? { email: owner.email } : {}), displayName: owner.displayName } : null,
      members: rows.map((r) => ({
        userId: r.m.userId,
        ...(addresses ? { email: r.email } : {}),
        displayName: r.displayName,
        access: r.m.access,
        createdAt: r.m.createdAt.toISOString(),
      })),
      invitations: pending.map(invitationJson),
    });
  });

  router.post('/invitations', async (req, res) => {
    const { pattern } = patternOf(res, 'owner');
    const user = currentUser(req);
    const body = parseOr400(invitationBodySchema, req.body);
    if (body.email === user.email) throw new HttpError(400, 'You own this pattern already', [{ path: 'email', message: 'is your own address' }]);
    const token = randomToken();
    const now = Date.now();
    const link = `${config.publicUrl}/invitations/accept?token=${encodeURIComponent(token)}`;
    // The invitation and its mail are stored together; the outbox delivers it (with retries).
    const invitation = await data.transaction(async (tx) => {
      const rows = await tx.db
        .insert(invitations)
        .values({
          id: newId(),
          tokenHash: hashToken(token),
          patternId: pattern.id,
          email: body.email,
          access: body.access,
          invitedBy: user.id,
          createdAt: new Date(now),
          expiresAt: new Date(now + config.invitationDays * 86_400_000),
        })
        .returning();
      await ctx.mailOutbox.enqueue(tx, 'invitation', { to: body.email, ...invitationMail(user.displayName, pattern.title, body.access, link, config.invitationDays) });
      return rows[0];
    });
    res.status(201).json({ invitation: invitationJson(invitation) });
  });

  router.delete('/invitations/:invitationId', async (req, res) => {
    const { pattern } = patternOf(res, 'owner');
    const invitationId = parseOr400(idSchema, req.params.invitationId, 'Invalid invitation id');
    const [revoked] = await db
      .update(invitations)
      .set({ revokedAt: new Date() })
      .where(and(eq(invitations.id, invitationId), eq(invitations.patternId, pattern.id), isNull(invitations.acceptedAt)))
      .returning();
    if (!revoked) throw new HttpError(404, 'Invitation not found');
    res.status(204).end();
  });

  router.patch('/members/:userId', async (req, res) => {
    const { pattern } = patternOf(res, 'owner');
    const userId = parseOr400(idSchema, req.params.userId, 'Invalid user id');
    const body = parseOr400(memberAccessBodySchema, req.body);
    const [updated] = await db
      .update(members)
      .set({ access: body.access })
      .where(and(eq(members.patternId, pattern.id), eq(members.userId, userId)))
      .returning();
    if (!updated) throw new HttpError(404, 'Member not found');
    res.json({ member: { userId: updated.userId, access: updated.access, createdAt: updated.createdAt.toISOString() } });
  });

  router.delete('/members/:userId', async (req, res) => {
    const { pattern, access } = patternOf(res);
    const user = currentUser(req);
    const userId = parseOr400(idSchema, req.params.userId, 'Invalid user id');
    if (access !== 'owner' && userId !== user.id) throw new HttpError(403, 'Only the owner can remove other members');
    const [removed] = await db
      .delete(members)
      .where(and(eq(members.patternId, pattern.id), eq(members.userId, userId)))
      .returning();
    if (!removed) throw new HttpError(404, 'Member not found');
    res.status(204).end();
  });

  return router;
}

function invitationJson(i: typeof invitations.$inferSelect) {
  return {
    id: i.id,
    email: i.email,
    access: i.access,
    createdAt: i.createdAt.toISOString(),
    expiresAt: i.expiresAt.toISOString(),
  };
}
