import { Router } from "express";
import { z } from "zod";
import type { AppContext } from "../../context";
import { storeInput, storeListQuery, storeUpdateInput, type StoreListQuery } from "#core/contracts/stores";
import { member, requireMember } from "../../middleware/auth";
import { parsedQuery, validate } from "../../middleware/validate";
import { getStoreDetail } from "./store-detail.service";
import { createStore, listStores, setArchived, updateStore } from "./stores.service";

const idParam = z.object({ id: z.uuid("must be a valid id") });

export function storesRouter(ctx: AppContext): Router {
  const router = Router();

  // Store contacts get only the stores on their membership (the invite form's picker uses this too).
  router.get("/stores", requireMember("stores.read"), validate(storeListQuery, "query"), async (req, res) => {
    res.json({ stores: await listStores(ctx, member(req), parsedQuery<StoreListQuery>(res)) });
  });

  router.post("/stores", requireMember("stores.edit"), validate(storeInput), async (req, res) => {
    res.status(201).json(await createStore(ctx, member(req).companyId, req.body));
  });

  router.get("/stores/:id", requireMember("stores.read"), validate(idParam, "params"), async (req, res) => {
    res.json(await getStoreDetail(ctx, member(req), res.locals.params.id));
  });

  router.patch(
    "/stores/:id",
    requireMember("stores.edit"),
    validate(idParam, "params"),
    validate(storeUpdateInput),
    async (req, res) => {
      res.json(await updateStore(ctx, member(req), res.locals.params.id, req.body));
    },
  );

  router.post("/stores/:id/archive", requireMember("stores.edit"), validate(idParam, "params"), async (req, res) => {
    res.json(await setArchived(ctx, member(req), res.locals.params.id, true));
  });

  router.post("/stores/:id/unarchive", requireMember("stores.edit"), validate(idParam, "params"), async (req, res) => {
    res.json(await setArchived(ctx, member(req), res.locals.params.id, false));
  });

  return router;
}
