import { ROLES, ROLE_LABELS } from "../../../../server/domain/roles";

export const ROLE_OPTIONS = ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));
