// Konva needs a 2D context; jsdom has none. The mock lets components mount, while real
// drawing is checked in Chromium by the browser suite.
import "vitest-canvas-mock";
