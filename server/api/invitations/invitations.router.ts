import { Router } from "express";
import { z } from "zod";
import { text } from "#core/contracts/text";
import type { AppContext } from "../../context";
import { acceptInvitationInput } from "#core/contracts/members";
import { validate } from "../../middleware/validate";
import { startSession } from "../auth/auth.service";
import { sessionInfo } from "../auth/session-info";
import { acceptInvitation, previewInvitation } from "./invitations.service";
import { readAuth } from "../../middleware/auth";

const tokenParam = z.object({ token: text().min(20, "is not a valid invitation link").max(200) });

export function invitationsRouter(ctx: AppContext): Router {
  const router = Router();

  router.get("/invitations/:token", validate(tokenParam, "params"), async (_req, res) => {
    res.json(await previewInvitation(ctx, res.locals.params.token));
  });

  router.post(
    "/invitations/:token/accept",
    validate(tokenParam, "params"),
    validate(acceptInvitationInput),
    async (req, res) => {
      const { userId, companyId } = await acceptInvitation(ctx, res.locals.params.token, req.body);
      await startSession(ctx, req, userId, companyId);
      req.auth = await readAuth(ctx.db, req.session);
      res.json(await sessionInfo(ctx, req));
    },
  );

  return router;
}
