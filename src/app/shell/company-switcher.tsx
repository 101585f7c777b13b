import { useNavigate } from "react-router";
import { ROLE_LABELS } from "#core/domain/roles";
import { Alert } from "../../components/ui/alert";
import { useSwitchCompany } from "../../features/auth/api/switch-company";
import type { Membership } from "../../features/auth/model/active-membership";
import { formErrorMessage } from "../../lib/form-errors";

export interface CompanySwitcherProps {
  memberships: readonly Membership[];
  active: Membership;
}

/** The company name, and a way to change company when the person belongs to several. */
export function CompanySwitcher({ memberships, active }: CompanySwitcherProps) {
  const switchCompany = useSwitchCompany();
  const navigate = useNavigate();
  const error = formErrorMessage(switchCompany.error);

  if (memberships.length < 2) {
    return (
      <p className="min-w-0">
        <span className="block truncate text-lg font-bold">{active.companyName}</span>
        <span className="block text-sm text-muted">{ROLE_LABELS[active.role]}</span>
      </p>
    );
  }
  return (
    <div className="min-w-0">
      <label htmlFor="company-switcher" className="sr-only">
        Company
      </label>
      <select
        id="company-switcher"
        value={active.companyId}
        disabled={switchCompany.isPending}
        onChange={(e) =>
          // The new company may not grant the page open now: start again from its stores.
          switchCompany.mutate(e.target.value, { onSuccess: () => void navigate("/") })
        }
        className="min-h-11 max-w-full rounded-md bg-surface px-3 text-lg font-bold text-ink edge"
      >
        {memberships.map((m) => (
          <option key={m.companyId} value={m.companyId}>
            {m.companyName} ({ROLE_LABELS[m.role]})
          </option>
        ))}
      </select>
      {error ? <Alert tone="error">{error}</Alert> : null}
    </div>
  );
}
