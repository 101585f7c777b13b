import { useCallback, useMemo, useRef, useState } from "react";
import type { FixtureKind } from "#core/contracts/fixture-kinds";
import type { FixturesResponse, Plan } from "#core/contracts/plans";
import type { LengthPreference } from "#core/domain/units/format-units";
import { Alert } from "../../../../components/ui/alert";
import { Button } from "../../../../components/ui/button";
import { Spinner } from "../../../../components/ui/spinner";
import { useHtmlImage } from "../../../../lib/use-html-image";
import { getPlanFixtures as getFixtures } from "../../../../entities/plans/plans-api";
import { useAutosave } from "../../hooks/use-autosave";
import { useEditorHistory } from "../../hooks/use-editor-history";
import { useWorkspaceStage } from "../../hooks/use-workspace-stage";
import { useEditorShortcuts, VIEW_KEY_HELP } from "../../hooks/use-editor-shortcuts";
import { applyAction, array, duplicate, remove, select, type SceneAction } from "../../model/actions";
import { stagePoint, zoomAbout, type View } from "../../../../lib/plan-view/coordinates";
import { duplicateOffset } from "../../model/duplicate-offset";
import { revealBox } from "../../model/reveal";
import { unionBounds } from "../../model/fixture-geometry";
import { createScene, sceneFixtures, selectedFixtures } from "../../model/scene";
import { SHORTCUT_HELP } from "../../model/shortcuts";
import { drawTool, type ActiveTool } from "../../model/tools/active-tool";
import { ScaleBar } from "../plan/scale-bar";
import { ArrayDialog } from "./array-dialog";
import { EditorStage } from "./editor-stage";
import { EditorToolbar, type DrawShape } from "./editor-toolbar";
import { FixtureTable } from "./fixture-table";
import { PropertiesPanel, type SystemOption } from "./properties-panel";
import { SaveStatus } from "./save-status";
import type { Backdrop } from "./stage-backdrop";

/** A blank plan has no pixels: give it a virtual image about 2000 px on its long side. */
const BLANK_LONG_SIDE_PX = 2000;

function backdropOf(plan: Plan, bounds: { width: number; height: number }, image: HTMLImageElement | null): Backdrop {
  if (plan.image && plan.metresPerPixel)
    return { image, widthPx: plan.image.widthPx, heightPx: plan.image.heightPx, metresPerPixel: plan.metresPerPixel };
  const mpp = Math.max(bounds.width, bounds.height) / BLANK_LONG_SIDE_PX;
  return { image: null, widthPx: bounds.width / mpp, heightPx: bounds.height / mpp, metresPerPixel: mpp };
}

export interface LayoutEditorProps {
  plan: Plan;
  initial: FixturesResponse;
  systems: readonly SystemOption[];
  preference: LengthPreference;
  canEdit: boolean;
}

/** The layout editor: the plan with its fixtures, the tools, the selection's properties and the list. */
export function LayoutEditor(props: LayoutEditorProps) {
  const image = useHtmlImage(props.plan.image?.displayUrl ?? null);
  if (props.plan.image && image.status === "loading") return <Spinner label="Loading the drawing…" />;
  if (props.plan.image && image.status === "failed")
    return <Alert tone="error">The plan's drawing could not be loaded. Reload the page to try again.</Alert>;
  return <EditorBody {...props} image={image.image} />;
}

function EditorBody({
  plan,
  initial,
  systems,
  preference,
  canEdit,
  image,
}: LayoutEditorProps & { image: HTMLImageElement | null }) {
  const bounds = initial.bounds!;
  const backdrop = useMemo(() => backdropOf(plan, bounds, image), [plan, bounds, image]);
  const editor = useEditorHistory(() => createScene(bounds, initial.fixtures));
  const { scene } = editor;
  const autosave = useAutosave(plan.id, scene, initial.layoutRevision, canEdit);
  const box = useRef<HTMLDivElement>(null);
  const bar = useRef<HTMLDivElement>(null);
  const [view, setView] = useState<View>({ panX: 0, panY: 0, zoom: 1 });
  const size = useWorkspaceStage(box, bar, backdrop, view, setView);
  const [kind, setKind] = useState<FixtureKind>("open-case");
  const [shape, setShape] = useState<DrawShape>("rectangle");
  const [active, setActive] = useState<ActiveTool>({ tool: "select" });
  const [gridM, setGridM] = useState<number | null>(preference === "ft-in" ? 0.1524 : 0.1);
  const [snapToFixtures, setSnapToFixtures] = useState(true);
  const [message, setMessage] = useState<string | null>(null);
  const [arrayOpen, setArrayOpen] = useState(false);
  const [panning, setPanning] = useState(false);
  const [reloading, setReloading] = useState(false);
  const [drawingOutline, setDrawingOutline] = useState(false);
  const toolKeys = useRef<((key: string) => boolean) | null>(null);

  const zoom = useCallback(
    (direction: "in" | "out" | "fit") => {
      if (direction === "fit") size.fit();
      else setView((v) => zoomAbout(v, stagePoint(size.width / 2, size.height / 2), direction === "in" ? 1.25 : 0.8));
    },
    [size],
  );

  const chooseTool = useCallback(
    (tool: "select" | "pan" | "vertex" | DrawShape, k: FixtureKind = kind) => {
      if (tool === "select" || tool === "pan" || tool === "vertex") setActive({ tool });
      else {
        setShape(tool);
        setActive(drawTool(k, tool));
      }
      const sel = scene.selection.length === 1 ? scene.fixtures[scene.selection[0]] : undefined;
      setMessage(
        tool === "vertex" && (!sel || "point" in sel)
          ? "The corner tool reshapes one outline: select it first (Select tool, or its row in the list), then drag its corners."
          : null,
      );
    },
    [kind, scene],
  );

  /** Applies a copying action and brings the originals and their copies into view. */
  const makeCopies = useCallback(
    (action: SceneAction) => {
      const originals = unionBounds(selectedFixtures(scene));
      const copies = unionBounds(selectedFixtures(applyAction(scene, action)));
      editor.apply([action]);
      if (!originals || !copies) return;
      const px = 1 / backdrop.metresPerPixel;
      const box = {
        minX: Math.min(originals.minX, copies.minX) * px,
        minY: Math.min(originals.minY, copies.minY) * px,
        maxX: Math.max(originals.maxX, copies.maxX) * px,
        maxY: Math.max(originals.maxY, copies.maxY) * px,
      };
      setView((v) => revealBox(v, box, size));
    },
    [scene, editor, backdrop, size],
  );

  const doDuplicate = useCallback(() => {
    if (scene.selection.length === 0) return;
    const [dx, dy] = duplicateOffset(scene, scene.selection);
    makeCopies(duplicate(scene.selection, dx, dy, () => crypto.randomUUID()));
  }, [scene, makeCopies]);

  const doDelete = useCallback(() => {
    if (scene.selection.length) editor.apply([remove(scene.selection)]);
  }, [scene.selection, editor]);

  useEditorShortcuts({
    enabled: true,
    canEdit,
    scene,
    gridM,
    editor,
    toolKeys,
    onDuplicate: doDuplicate,
    onDelete: doDelete,
    onTool: chooseTool,
    onZoom: zoom,
    onPanning: setPanning,
    onEscape: () => (active.tool !== "select" ? chooseTool("select") : editor.apply([select([])])),
  });

  async function reloadTheirs() {
    setReloading(true);
    try {
      const fresh = await getFixtures(plan.id);
      const loaded = createScene(fresh.bounds ?? bounds, fresh.fixtures);
      editor.reset(loaded);
      autosave.rebase(loaded, fresh.layoutRevision);
    } finally {
      setReloading(false);
    }
  }

  const selection = selectedFixtures(scene);
  const selBox = unionBounds(selection);
  const fixtures = useMemo(() => sceneFixtures(scene), [scene]);
  const onSelectRow = useCallback(
    (id: string, additive: boolean) => editor.apply([select([id], additive ? "toggle" : "replace")]),
    [editor],
  );
  const state = autosave.state;

  // At least a window tall from the tools down, so the page can always scroll them to the top.
  return (
    <div className="min-h-dvh space-y-3">
      <div
        ref={bar}
        className="flex flex-nowrap items-center justify-between gap-2 sm:flex-wrap"
        data-testid="editor-bar"
      >
        <EditorToolbar
          active={active}
          kind={kind}
          canEdit={canEdit}
          canUndo={editor.history.past.length > 0 || drawingOutline}
          canRedo={editor.history.future.length > 0}
          hasSelection={scene.selection.length > 0}
          gridM={gridM}
          snapToFixtures={snapToFixtures}
          preference={preference}
          onTool={chooseTool}
          onKind={(k) => {
            setKind(k);
            if (active.tool === "rectangle" || active.tool === "polygon" || active.tool === "point")
              setActive(drawTool(k, shape));
          }}
          // Half way through an outline, Undo takes back the last corner (Backspace on a keyboard;
          // a tablet has only the button).
          onUndo={drawingOutline ? () => void toolKeys.current?.("Backspace") : editor.undo}
          onRedo={editor.redo}
          onDuplicate={doDuplicate}
          onArray={() => setArrayOpen(true)}
          onDelete={doDelete}
          onZoom={zoom}
          onGrid={setGridM}
          onSnapToFixtures={setSnapToFixtures}
        />
        {canEdit ? <SaveStatus state={state} onRetry={autosave.saveNow} /> : <p className="font-bold">Read only</p>}
      </div>
      {state.status === "conflict" ? (
        <Alert tone="error" title="Someone else changed this layout">
          <p>{state.message}</p>
          <p>
            Your recent changes are still on screen but were not saved. Reload their version to go on editing; then redo
            your change.
          </p>
          <Button className="mt-2" busy={reloading} onClick={() => void reloadTheirs()}>
            Reload theirs
          </Button>
        </Alert>
      ) : null}
      {state.status === "invalid" ? (
        <Alert tone="error" title="These problems keep the layout from being saved">
          <ul className="list-disc pl-5">
            {state.errors.slice(0, 6).map((e) => (
              <li key={e.path + e.message}>
                {describePath(e.path, fixtures)} {e.message}
              </li>
            ))}
          </ul>
        </Alert>
      ) : null}
      {/* From a landscape tablet (lg, 1024 px) up, the selection's panel sits beside the plan, in
          reach of the hand that just tapped a fixture. Below that one column whose width is the
          page's, not the canvas's: a grid item's min-width is its content, and the stage would
          keep itself as wide as it started. */}
      <div className="grid grid-cols-1 items-start gap-3 lg:grid-cols-[minmax(0,1fr)_20rem] xl:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="relative min-w-0">
          <div
            ref={box}
            className="overflow-hidden rounded-md bg-paper edge"
            data-testid="layout-stage"
            data-zoom={view.zoom}
            data-pan-x={view.panX}
            data-pan-y={view.panY}
            data-mpp={backdrop.metresPerPixel}
            data-plan-width={scene.plan.width}
            data-plan-height={scene.plan.height}
            aria-label="Floor plan with fixtures. The list below holds the same fixtures for keyboard and screen reader use."
            role="application"
          >
            <EditorStage
              scene={scene}
              backdrop={backdrop}
              view={view}
              onViewChange={setView}
              width={size.width}
              height={size.height}
              active={active}
              panning={panning}
              canEdit={canEdit && state.status !== "conflict"}
              gridM={gridM}
              showGrid={backdrop.image === null || gridM !== null}
              snapToFixtures={snapToFixtures}
              apply={editor.apply}
              endGesture={editor.endGesture}
              onMessage={setMessage}
              onDrawingOutline={setDrawingOutline}
              toolKeys={toolKeys}
            />
          </div>
          {/* Over the plan, not above it: a message pushing the stage down would move it under the finger mid-drawing. */}
          {message ? (
            <div className="pointer-events-none absolute left-2 right-2 top-2" data-testid="editor-message">
              <Alert tone="note">{message}</Alert>
            </div>
          ) : null}
          <div className="pointer-events-none absolute bottom-2 left-2 rounded bg-surface/90 px-2 py-1 edge">
            <ScaleBar
              metresPerScreenPixel={backdrop.metresPerPixel / view.zoom}
              preference={preference}
              maxPixels={150}
            />
          </div>
        </div>
        <aside aria-labelledby="props-heading" className="space-y-3 rounded-md bg-surface p-3 edge">
          <h2 id="props-heading" className="text-lg font-bold">
            Selection
          </h2>
          {arrayOpen && selBox ? (
            <ArrayDialog
              size={{ width: selBox.maxX - selBox.minX, depth: selBox.maxY - selBox.minY }}
              preference={preference}
              onClose={() => setArrayOpen(false)}
              onArray={(count, spacing, direction) => {
                try {
                  makeCopies(array(scene.selection, count, spacing, direction, () => crypto.randomUUID()));
                  setArrayOpen(false);
                  // Back to the plan to see the copies (below xl the dialog sits under the stage).
                  box.current?.scrollIntoView?.({ block: "nearest" });
                } catch (e) {
                  setMessage(e instanceof RangeError ? e.message : "The copies could not be made.");
                }
              }}
            />
          ) : null}
          <PropertiesPanel
            selection={selection}
            systems={systems}
            preference={preference}
            canEdit={canEdit}
            apply={editor.apply}
          />
          <details>
            <summary className="min-h-11 cursor-pointer py-2 font-bold">Keyboard shortcuts</summary>
            <dl className="grid grid-cols-[max-content_1fr] gap-x-3 text-sm">
              {[...SHORTCUT_HELP, ...VIEW_KEY_HELP].map(({ keys, does }) => (
                <div key={keys} className="contents">
                  <dt className="font-bold">{keys}</dt>
                  <dd>{does}</dd>
                </div>
              ))}
            </dl>
          </details>
        </aside>
      </div>
      <section aria-labelledby="list-heading" className="space-y-2">
        <h2 id="list-heading" className="text-lg font-bold">
          All fixtures ({fixtures.length})
        </h2>
        <FixtureTable scene={scene} systems={systems} preference={preference} onSelect={onSelectRow} />
      </section>
    </div>
  );
}

/** "fixtures.3.polygon.1" → "Dairy 4 (fixture 4), corner 2:" in words the lead tech can act on. */
function describePath(path: string, fixtures: readonly { label: string }[]): string {
  const parts = path.split(".");
  const i = Number(parts[1]);
  const f = fixtures[i];
  const who = f ? `${f.label || "Unlabelled fixture"} (fixture ${i + 1})` : path;
  if (parts[2] === "polygon" && parts[3] !== undefined) return `${who}, corner ${Number(parts[3]) + 1}:`;
  return parts[2] ? `${who}, ${parts[2]}:` : `${who}:`;
}
