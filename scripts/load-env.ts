import { loadDotEnv } from "./env-file";

/** Side-effect import: load .env before any module reads the environment (import this first). */
loadDotEnv();
