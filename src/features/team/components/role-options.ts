import { ROLES, ROLE_LABELS } from "#core/domain/roles";

export const ROLE_OPTIONS = ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));
