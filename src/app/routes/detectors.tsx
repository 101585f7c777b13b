import { useState } from "react";
import { useLocation } from "react-router";
import { useScrollToHash } from "../../lib/use-scroll-to-hash";
import { PRINCIPLE_LABELS, type Detector } from "#core/contracts/detectors";
import { can } from "#core/domain/roles";
import { Button } from "../../components/ui/button";
import { PageHeader } from "../../components/ui/page-header";
import { QueryError } from "../../components/ui/query-error";
import { Spinner } from "../../components/ui/spinner";
import { useDetectors } from "../../entities/detectors/detectors-api";
import { useArchiveDetector } from "../../features/detectors/api/detectors-api";
import { DetectorForm } from "../../features/detectors/components/detector-form";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";
import { Component as NotFound } from "./not-found";

export function Component() {
  useDocumentTitle("Detectors");
  const { membership } = useSignedIn();
  const canRead = can(membership.role, "detectors.read");
  const canManage = can(membership.role, "detectors.manage");
  const [showArchived, setShowArchived] = useState(false);
  const [editing, setEditing] = useState<Detector | "new" | null>(null);
  const list = useDetectors(showArchived);
  const archive = useArchiveDetector();
  const { hash } = useLocation();
  useScrollToHash(!!list.data);
  if (!canRead) return <NotFound />;
  return (
    <>
      <PageHeader
        title="Detectors"
        description="The company's leak detectors: their lag figures correct where each reading's air was sampled, and an overdue check is flagged when a sweep starts."
        actions={
          canManage && editing === null ? <Button onClick={() => setEditing("new")}>Add a detector</Button> : null
        }
      />
      {editing ? (
        <section className="mb-6 rounded-md bg-surface p-4 edge">
          <h2 className="mb-3 text-xl font-bold">{editing === "new" ? "New detector" : `Edit ${editing.name}`}</h2>
          <DetectorForm existing={editing === "new" ? null : editing} onDone={() => setEditing(null)} />
        </section>
      ) : null}
      <label className="mb-3 flex min-h-11 items-center gap-2">
        <input
          type="checkbox"
          className="size-5"
          checked={showArchived}
          onChange={(e) => setShowArchived(e.target.checked)}
        />{" "}
        Show archived
      </label>
      {list.isPending ? <Spinner label="Loading detectors…" /> : null}
      {list.isError ? <QueryError error={list.error} what="the detectors" onRetry={() => void list.refetch()} /> : null}
      {list.data ? (
        <div className="overflow-x-auto">
          <table className="w-full border-collapse text-left">
            <thead>
              <tr className="edge border-x-0 border-t-0">
                {["Name", "Principle", "Delay", "Time constant", "Alarm", "Display", "Check due", ""].map((h) => (
                  <th key={h} className="p-2">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {list.data.map((d) => (
                <tr
                  key={d.id}
                  id={`detector-${d.id}`}
                  className={`edge border-x-0 border-t-0 ${hash === `#detector-${d.id}` ? "bg-accent-soft" : ""}`}
                >
                  <td className="p-2 font-bold">
                    {d.name}
                    {d.archivedAt ? " (archived)" : ""}
                  </td>
                  <td className="p-2">{PRINCIPLE_LABELS[d.principle]}</td>
                  <td className="p-2">{d.transportDelayS} s</td>
                  <td className="p-2">{d.timeConstantS} s</td>
                  <td className="p-2">{d.alarmPpm} ppm</td>
                  <td className="p-2">
                    {d.levelScale?.length
                      ? `${d.levelScale.length} levels (${d.levelScale.map((b) => b.level).join(", ")})`
                      : "ppm"}
                  </td>
                  <td className={`p-2 ${d.overdue ? "font-bold text-danger" : ""}`}>
                    {d.checkDueOn ?? "never checked"}
                    {d.overdue ? " — overdue" : ""}
                  </td>
                  <td className="p-2">
                    {canManage ? (
                      <div className="flex gap-2">
                        <Button variant="secondary" onClick={() => setEditing(d)}>
                          Edit
                        </Button>
                        <Button variant="quiet" onClick={() => archive.mutate({ id: d.id, archived: !d.archivedAt })}>
                          {d.archivedAt ? "Restore" : "Archive"}
                        </Button>
                      </div>
                    ) : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {list.data.length === 0 ? <p className="p-2">No detectors yet.</p> : null}
        </div>
      ) : null}
    </>
  );
}
