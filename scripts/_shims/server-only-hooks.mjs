export async function resolve(specifier, context, next) {
  if (specifier === "server-only") return { url: new URL("./empty.mjs", import.meta.url).href, shortCircuit: true };
  return next(specifier, context);
}
