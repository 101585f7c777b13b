/** The layers a reader can switch on and off over the field. */
export const MAP_LAYERS = ["field", "taps", "corrected", "path", "fixtures", "riskPoints", "suspects"] as const;
export type MapLayer = (typeof MAP_LAYERS)[number];

export const LAYER_LABELS: Record<MapLayer, string> = {
  field: "Concentration field",
  taps: "Tap positions (raw)",
  corrected: "Sampled positions (lag-corrected)",
  path: "Walked path",
  fixtures: "Fixtures",
  riskPoints: "Risk points",
  suspects: "Suspect spots",
};

export type LayerState = Record<MapLayer, boolean>;

export const DEFAULT_LAYERS: LayerState = {
  field: true,
  taps: false,
  corrected: true,
  path: true,
  fixtures: true,
  riskPoints: true,
  suspects: true,
};
