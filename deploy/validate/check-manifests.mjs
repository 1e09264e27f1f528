// Checks Kubernetes manifests against the Kubernetes API schemas, with no cluster:
//  1. each document's schema (types, formats, enums, required members) with the validator kubernetes-models
//     ships for its apiVersion and kind;
//  2. unknown members (a typo such as `replica:` is silently ignored by a cluster) with TypeScript's
//     excess-property check: every document is written as an object literal of the model's own interface.
// Usage: node check-manifests.mjs DIR...  (every *.yaml in each DIR; exit 1 on the first failing file set)
import { readdirSync, readFileSync, writeFileSync, mkdirSync } from "node:fs";
import { join, resolve } from "node:path";
import { execFileSync } from "node:child_process";
import { parseAllDocuments } from "yaml";

const MAX_DOCUMENTS = 200; // a cap on the work: deploy/ holds a handful

const here = new URL(".", import.meta.url).pathname;
const dirs = process.argv.slice(2);
if (dirs.length === 0) {
  console.error("usage: node check-manifests.mjs DIR...");
  process.exit(2);
}

// apiVersion/kind -> module of the model ("monitoring.coreos.com" comes from the operator's own package)
function modelPath(apiVersion, kind) {
  const pkg = apiVersion.startsWith("monitoring.coreos.com/")
    ? "@kubernetes-models/prometheus-operator"
    : "kubernetes-models";
  return `${pkg}/${apiVersion}/${kind}`;
}

const documents = [];
for (const dir of dirs) {
  for (const name of readdirSync(dir).filter((f) => f.endsWith(".yaml")).sort()) {
    const file = join(dir, name);
    parseAllDocuments(readFileSync(file, "utf8")).forEach((doc, index) => {
      if (doc.errors.length > 0) {
        documents.push({ file, index, error: `YAML: ${doc.errors[0].message}` });
        return;
      }
      const value = doc.toJS();
      if (value !== null) documents.push({ file, index, value });
    });
  }
}
if (documents.length > MAX_DOCUMENTS) {
  console.error(`more than ${MAX_DOCUMENTS} documents`);
  process.exit(2);
}

const failures = [];
const typed = [];
for (const [n, d] of documents.entries()) {
  const where = `${d.file} (document ${d.index + 1})`;
  if (d.error) {
    failures.push(`${where}: ${d.error}`);
    continue;
  }
  const { apiVersion, kind } = d.value;
  if (typeof apiVersion !== "string" || typeof kind !== "string") {
    failures.push(`${where}: apiVersion and kind are required`);
    continue;
  }
  let model;
  try {
    model = await import(modelPath(apiVersion, kind));
  } catch {
    failures.push(`${where}: unknown apiVersion/kind ${apiVersion} ${kind}`);
    continue;
  }
  try {
    new model[kind](d.value).validate();
  } catch (e) {
    failures.push(`${where}: ${e.message}`);
  }
  typed.push({ n, where, kind, path: modelPath(apiVersion, kind), value: d.value });
}

// Unknown members: one object literal per document, typed by the model's interface.
const generated = join(here, "generated");
mkdirSync(generated, { recursive: true });
let source = "";
for (const t of typed) {
  source += `import type { I${t.kind} as T${t.n} } from "${t.path}";\n`;
}
for (const t of typed) {
  source += `// ${t.where}\nexport const doc${t.n}: T${t.n} = ${JSON.stringify(t.value)};\n`;
}
writeFileSync(join(generated, "manifests.ts"), source);
writeFileSync(
  join(generated, "tsconfig.json"),
  JSON.stringify({
    compilerOptions: {
      strict: true, noEmit: true, module: "nodenext", moduleResolution: "nodenext", target: "es2022",
      skipLibCheck: true, typeRoots: [],
    },
    files: ["manifests.ts"],
  }),
);
try {
  execFileSync(process.execPath, [join(here, "node_modules", "typescript", "bin", "tsc"), "-p", generated], {
    stdio: "pipe",
  });
} catch (e) {
  const lines = String(e.stdout).split("\n").filter((l) => l.includes("error TS"));
  for (const line of lines) {
    const m = /manifests\.ts\((\d+),/.exec(line);
    const comment = m ? source.split("\n")[Number(m[1]) - 2] : "";
    failures.push(`${comment.replace("// ", "")}: ${line.replace(/^.*error TS\d+: /, "")}`);
  }
}

if (failures.length > 0) {
  for (const f of failures) console.error(`manifest check: ${f}`);
  process.exit(1);
}
console.log(`manifest check: ${documents.length} documents valid (${dirs.map((d) => resolve(d)).join(", ")})`);
