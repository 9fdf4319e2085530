// Lets plain Node scripts (seed, mail delivery) import modules marked `import "server-only"`.
// That marker only guards against bundling server code into a browser build; outside Next it
// would refuse everything, so scripts resolve it to an empty module instead.
import { register } from "node:module";

register(
  "data:text/javascript," +
    encodeURIComponent(
      'export async function resolve(specifier, context, next) { if (specifier === "server-only") return { url: "data:text/javascript,", shortCircuit: true }; return next(specifier, context); }',
    ),
);
