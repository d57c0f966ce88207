// Worker-thread entry for the cell-fit pool. Plain JavaScript so that Node can load it in a worker under `next start`
// as well as under tsx; it registers tsx's loader (a runtime dependency) and loads the TypeScript task module.
import { register } from "tsx/esm/api";

register({ tsconfig: new URL("../../tsconfig.json", import.meta.url).pathname });
const mod = await import(new URL("./fit-worker.ts", import.meta.url).href);

export default mod.default;
