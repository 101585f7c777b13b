import "@fontsource/atkinson-hyperlegible/400.css";
import "@fontsource/atkinson-hyperlegible/700.css";
import "./index.css";
import { StrictMode } from "react";
import { createRoot } from "react-dom/client";
import { AppProviders } from "./app/providers";
import { applyStoredContrast } from "./lib/contrast";

// Before the first paint, so a high-contrast user never sees the calm palette flash.
applyStoredContrast();

const root = document.getElementById("root");
if (!root) throw new Error("index.html has no #root element");
createRoot(root).render(
  <StrictMode>
    <AppProviders />
  </StrictMode>,
);
