// Import aliases shared by Vite and Vitest (tsx reads the same ones from tsconfig.json's "paths").
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.dirname(fileURLToPath(import.meta.url));
export const aliases = { "@shared": path.join(root, "shared"), "@": path.join(root, "src") };
