import { defineConfig } from "vite";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";
import { VitePWA } from "vite-plugin-pwa";

// The client is served by the Express process in production (npm start); in `npm run dev`
// Vite serves it and forwards /api to the API server.
export default defineConfig({
  plugins: [
    react(),
    tailwindcss(),
    // A service worker keeps the app shell (HTML, JS, CSS, fonts) so the app reloads offline.
    // It never answers /api: the API is only ever the network's answer (sweep data lives in
    // IndexedDB, managed by the app), so no stale or other person's API response is served.
    VitePWA({
      registerType: "autoUpdate",
      injectRegister: "script-defer",
      manifest: {
        name: "Plumeline",
        short_name: "Plumeline",
        description: "Floor-plan refrigerant leak locator and leak records",
        theme_color: "#1f4e5f",
        background_color: "#f7f8f6",
        display: "standalone",
        start_url: "/",
        icons: [],
      },
      workbox: {
        globPatterns: ["**/*.{js,css,html,woff,woff2,svg,png,webmanifest}"],
        navigateFallback: "/index.html",
        navigateFallbackDenylist: [/^\/api\//],
        runtimeCaching: [],
        cleanupOutdatedCaches: true,
        // Take over the open tab at once, so a sweep started on first visit survives an offline reload.
        clientsClaim: true,
        skipWaiting: true,
        maximumFileSizeToCacheInBytes: 3 * 1024 * 1024,
      },
      devOptions: { enabled: false },
    }),
  ],
  build: { outDir: "dist/client", emptyOutDir: true, chunkSizeWarningLimit: 1500 },
  server: { proxy: { "/api": "http://127.0.0.1:3000" } },
});
