import { Card, RowChoiceForm } from "./ui";
import { countOf } from "~/content/count";
import { formatDay } from "~/content/dates";

export interface UnassignedAccountView {
  id: string;
  name: string;
  signedUpAt: string;
  people: { name: string; email: string }[];
}

/**
 * New machine builders nobody follows yet. With `managers` (the admin's home) each row assigns
 * one; without (an account manager's dashboard) it says an admin will.
 */
export function UnassignedAccounts({
  accounts,
  total,
  managers,
}: {
  accounts: UnassignedAccountView[];
  total: number;
  managers?: { id: string; name: string }[];
}) {
  if (total === 0) return null;
  return (
    <Card className="mb-6 ring-2 ring-signal-500">
      <h2 className="font-semibold">Unassigned machine builders ({total})</h2>
      <p className="mb-3 text-sm text-ink-600">
        {managers
          ? `${countOf(total, "new buyer account")} without an account manager, oldest first. Choose who follows each.`
          : "New buyer accounts nobody follows yet. An administrator assigns each to an account manager on the Users page; say if one should be yours."}
      </p>
      <ul className="divide-y divide-ink-100">
        {accounts.map((a) => (
          <li key={a.id} className="grid gap-2 py-3 text-sm md:grid-cols-[1fr_auto]">
            <div>
              <p className="font-semibold">
                {a.name} <span className="font-normal text-signal-700">· unassigned</span>
              </p>
              <p className="text-ink-600">Signed up {formatDay(a.signedUpAt)}</p>
              {a.people.map((p) => (
                <p key={p.email} className="break-all text-ink-600">
                  {p.name} · {p.email}
                </p>
              ))}
            </div>
            {managers ? (
              <RowChoiceForm
                id={`assign-${a.id}`}
                name="managerId"
                label={`Account manager for ${a.name}`}
                value=""
                options={[{ value: "", label: "Choose an account manager" }, ...managers.map((m) => ({ value: m.id, label: m.name }))]}
                fields={{ intent: "assign-manager", organisationId: a.id }}
              />
            ) : null}
          </li>
        ))}
      </ul>
    </Card>
  );
}
