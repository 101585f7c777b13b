-- Hand-written: every existing system gets its in-service day (the day it was entered, on its
-- store's calendar) and a first revision from its current values, so history has a starting point
-- (docs/decisions/0043-system-revisions.md).
UPDATE "systems" AS s
SET "in_service_on" = (s."created_at" AT TIME ZONE st."time_zone")::date
FROM "stores" AS st
WHERE st."id" = s."store_id" AND s."in_service_on" IS NULL;
--> statement-breakpoint
INSERT INTO "system_revisions" (
  "company_id", "system_id", "effective_from", "kind", "refrigerant_id", "full_charge_kg",
  "appliance_type", "automatic_leak_detection", "in_service_on", "reason", "by_id", "recorded_at"
)
SELECT s."company_id", s."id", s."in_service_on", 'first', s."refrigerant_id", s."full_charge_kg",
  s."appliance_type", s."automatic_leak_detection", s."in_service_on",
  'Values when revisions were introduced', NULL, now()
FROM "systems" AS s
WHERE NOT EXISTS (SELECT 1 FROM "system_revisions" r WHERE r."system_id" = s."id");
