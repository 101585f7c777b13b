import { Checkbox } from "../../../components/ui/checkbox";
import { LAYER_LABELS, MAP_LAYERS, type LayerState } from "../model/layers";

export function LayerToggles({
  layers,
  onChange,
  log,
  onLog,
}: {
  layers: LayerState;
  onChange(l: LayerState): void;
  log: boolean;
  onLog(v: boolean): void;
}) {
  return (
    <fieldset className="rounded-md edge bg-surface p-3">
      <legend className="px-1 font-bold">Layers</legend>
      <div className="grid gap-x-4 sm:grid-cols-2">
        {MAP_LAYERS.map((k) => (
          <Checkbox
            key={k}
            label={LAYER_LABELS[k]}
            checked={layers[k]}
            onChange={(e) => onChange({ ...layers, [k]: e.currentTarget.checked })}
          />
        ))}
        <Checkbox
          label="Log scale (1, 10, 100 ppm equally spaced)"
          checked={log}
          onChange={(e) => onLog(e.currentTarget.checked)}
        />
      </div>
    </fieldset>
  );
}
