// Outside Next.js (the worker, seeds, benchmarks) our server modules' `import "server-only"`
// marker would throw; this loader hook resolves it to an empty module instead.
import { register } from "node:module";

if (!globalThis.__strutwiseServerOnlyHook) {
  globalThis.__strutwiseServerOnlyHook = true;
  const hook = `export async function resolve(specifier, context, next) {
    if (specifier === "server-only") return { url: "data:text/javascript,export{}", shortCircuit: true };
    return next(specifier, context);
  }`;
  register(`data:text/javascript,${encodeURIComponent(hook)}`);
}
