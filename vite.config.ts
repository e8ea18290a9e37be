/// <reference types="vitest/config" />
import tailwindcss from "@tailwindcss/vite";
import react from "@vitejs/plugin-react";
import { defineConfig } from "vite";
import { aliases } from "./aliases.ts";

export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: { alias: aliases },
  server: { proxy: { "/api": "http://127.0.0.1:3000" } },
  build: { outDir: "dist", chunkSizeWarningLimit: 1500 },
});
