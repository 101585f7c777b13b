import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../context";
import { inviteInput, memberUpdateInput } from "#core/contracts/members";
import { member, requireMember } from "../../middleware/auth";
import { validate } from "../../middleware/validate";
import { invite, listTeam, removeMember, resendInvitation, revokeInvitation, updateMember } from "./team.service";

const idParam = z.object({ id: z.uuid("must be a valid id") });

export function teamRouter(ctx: AppContext): Router {
  const router = Router();

  router.get("/team", requireMember("members.read"), async (req, res) => {
    res.json(await listTeam(ctx, member(req).companyId));
  });

  router.post("/team/invitations", requireMember("members.manage"), validate(inviteInput), async (req, res) => {
    const { created, invitation } = await invite(ctx, member(req).companyId, req.auth!.user.id, req.body);
    res.status(created ? 201 : 200).json(invitation);
  });

  router.post(
    "/team/invitations/:id/resend",
    requireMember("members.manage"),
    validate(idParam, "params"),
    async (req, res) => {
      res.json(await resendInvitation(ctx, member(req).companyId, req.auth!.user.id, res.locals.params.id));
    },
  );

  router.delete(
    "/team/invitations/:id",
    requireMember("members.manage"),
    validate(idParam, "params"),
    async (req, res) => {
      await revokeInvitation(ctx, member(req).companyId, res.locals.params.id);
      res.status(204).end();
    },
  );

  router.patch(
    "/team/members/:id",
    requireMember("members.manage"),
    validate(idParam, "params"),
    validate(memberUpdateInput),
    async (req, res) => {
      res.json(
        await updateMember(
          ctx,
          member(req).companyId,
          res.locals.params.id,
          req.body.role,
          req.body.storeIds,
          req.auth!.user.id,
        ),
      );
    },
  );

  router.delete("/team/members/:id", requireMember("members.manage"), validate(idParam, "params"), async (req, res) => {
    await removeMember(ctx, member(req).companyId, res.locals.params.id, req.auth!.user.id);
    res.status(204).end();
  });

  return router;
}
