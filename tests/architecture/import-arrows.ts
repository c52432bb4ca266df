// The arrows of the architecture (DEVELOPERS.md, "The arrows") as data, and a reader that
// finds every import in the source tree with the TypeScript parser, so a stray import of a
// store module from the core, or of a shell from the page, fails `npm test`.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import ts from 'typescript';

export type Layer = 'core' | 'store' | 'service' | 'shell-common' | 'desktop' | 'local' | 'cli' | 'build' | 'renderer' | 'migrations' | 'demo-fixtures';

export interface FoundImport {
  /** The importing file, relative to the repository root with forward slashes. */
  from: string;
  specifier: string;
  /** `import type`, `export type` or an import whose every name is a type: erased at build time. */
  typeOnly: boolean;
}

/** Where each layer's files live, most specific first. */
const LAYER_FOLDERS: readonly (readonly [string, Layer])[] = [
  ['src-main/core/', 'core'],
  ['src-main/store/', 'store'],
  ['src-main/service/', 'service'],
  ['src-main/shell-common/', 'shell-common'],
  ['src-main/desktop/', 'desktop'],
  ['src-main/local/', 'local'],
  ['src-main/cli/', 'cli'],
  ['src-main/build/', 'build'],
  ['src-renderer/', 'renderer'],
  ['migrations/', 'migrations'],
  ['demo-fixtures/', 'demo-fixtures'],
];

const SHELL_MAY_IMPORT: readonly Layer[] = ['core', 'store', 'service', 'shell-common', 'demo-fixtures'];

/** Which layers each layer may import from (its own always included). */
const ARROWS: Readonly<Record<Layer, readonly Layer[]>> = {
  core: [],
  // The migration provider imports the migrations statically.
  store: ['core', 'migrations'],
  service: ['core', 'store'],
  'shell-common': [],
  desktop: SHELL_MAY_IMPORT,
  local: SHELL_MAY_IMPORT,
  cli: SHELL_MAY_IMPORT,
  build: ['core', 'store', 'service'],
  // Narrowed further by RENDERER_SERVICE_FILES below.
  renderer: ['core', 'service'],
  // A migration is a frozen snapshot of the schema as it was: it imports no live code.
  migrations: [],
  'demo-fixtures': ['core', 'service'],
};

/**
 * The service files the page may import: the contract, the bridge type and the handler map's
 * types (erased, never bundled), and the edge schemas the forms validate with before a call,
 * with the one function that turns a schema's refusal into the service's field-named message.
 */
const RENDERER_SERVICE_FILES: readonly { file: string; typeOnly: boolean }[] = [
  { file: 'src-main/service/contract', typeOnly: false },
  { file: 'src-main/service/bridge-api', typeOnly: true },
  { file: 'src-main/service/handlers', typeOnly: true },
  { file: 'src-main/service/schemas/', typeOnly: false },
  { file: 'src-main/service/validate', typeOnly: false },
];

/** Packages that do I/O or need Node or Electron: never in the core or the page. */
const NODE_ONLY_PACKAGE = /^(node:|electron$|better-sqlite3$|kysely$|pg$|fs$|path$|os$|child_process$)/;

/** Where the aliases point (tsconfig `paths`, Vite and Vitest `resolve.alias`). */
export const ALIASES: Readonly<Record<string, string>> = {
  $core: 'src-main/core',
  $service: 'src-main/service',
};

export function layerOf(file: string): Layer | null {
  for (const [folder, layer] of LAYER_FOLDERS) if (file.startsWith(folder)) return layer;
  return null;
}

/** The repository-relative path an import names, or null for a package. */
export function resolveSpecifier(from: string, specifier: string): string | null {
  for (const [alias, target] of Object.entries(ALIASES)) {
    if (specifier === alias || specifier.startsWith(`${alias}/`)) return target + specifier.slice(alias.length);
  }
  if (!specifier.startsWith('.')) return null;
  return path.posix.normalize(path.posix.join(path.posix.dirname(from), specifier));
}

/** Every import and re-export in one file's text (a .svelte file's scripts included). */
export function importsIn(from: string, text: string): FoundImport[] {
  const sources = from.endsWith('.svelte') ? [...text.matchAll(/<script\b[^>]*>([\s\S]*?)<\/script>/g)].map((m) => m[1] ?? '') : [text];
  const found: FoundImport[] = [];
  for (const source of sources) {
    const file = ts.createSourceFile(from, source, ts.ScriptTarget.ES2022, true, ts.ScriptKind.TS);
    const visit = (node: ts.Node): void => {
      if (ts.isImportDeclaration(node) && ts.isStringLiteral(node.moduleSpecifier)) {
        const clause = node.importClause;
        const bindings = clause?.namedBindings;
        const everyNameIsType = clause !== undefined && clause.name === undefined && bindings !== undefined && ts.isNamedImports(bindings) && bindings.elements.length > 0 && bindings.elements.every((e) => e.isTypeOnly);
        found.push({ from, specifier: node.moduleSpecifier.text, typeOnly: (clause?.isTypeOnly ?? false) || everyNameIsType });
      } else if (ts.isExportDeclaration(node) && node.moduleSpecifier && ts.isStringLiteral(node.moduleSpecifier)) {
        found.push({ from, specifier: node.moduleSpecifier.text, typeOnly: node.isTypeOnly });
      } else if (ts.isCallExpression(node) && node.expression.kind === ts.SyntaxKind.ImportKeyword && node.arguments[0] && ts.isStringLiteral(node.arguments[0])) {
        found.push({ from, specifier: node.arguments[0].text, typeOnly: false });
      } else if (ts.isImportTypeNode(node) && ts.isLiteralTypeNode(node.argument) && ts.isStringLiteral(node.argument.literal)) {
        found.push({ from, specifier: node.argument.literal.text, typeOnly: true });
      }
      ts.forEachChild(node, visit);
    };
    visit(file);
  }
  return found;
}

/** Why an import breaks the arrows, or null when it keeps to them. */
export function arrowProblem(imp: FoundImport): string | null {
  const fromLayer = layerOf(imp.from);
  if (fromLayer === null) return null;
  const target = resolveSpecifier(imp.from, imp.specifier);
  const what = `${imp.from} imports '${imp.specifier}'`;
  if (target === null) {
    if ((fromLayer === 'core' || fromLayer === 'renderer') && NODE_ONLY_PACKAGE.test(imp.specifier)) return `${what}: the ${fromLayer} runs without Node, Electron or the store`;
    return null;
  }
  const toLayer = layerOf(target);
  // The command line reads its version from the package manifest.
  if (toLayer === null) return target === 'package.json' && fromLayer === 'cli' ? null : `${what}: outside every layer`;
  if (toLayer === fromLayer) return null;
  if (!ARROWS[fromLayer].includes(toLayer)) return `${what}: ${fromLayer} may not import ${toLayer}`;
  if (fromLayer === 'renderer' && toLayer === 'service') {
    const allowed = RENDERER_SERVICE_FILES.find((a) => (a.file.endsWith('/') ? target.startsWith(a.file) : target === a.file || target === `${a.file}.ts`));
    if (!allowed) return `${what}: the page sees only the service contract, the handler types and the edge schemas`;
    if (allowed.typeOnly && !imp.typeOnly) return `${what}: only as \`import type\` (the page must not bundle it)`;
  }
  // One spelling per target, so a move of the core or the service touches only the aliases.
  if (fromLayer === 'renderer' && toLayer === 'core' && !imp.specifier.startsWith('$core/')) return `${what}: the page reaches the core through $core/…`;
  if (fromLayer === 'renderer' && toLayer === 'service' && !imp.specifier.startsWith('$service/')) return `${what}: the page reaches the service contract through $service/…`;
  return null;
}

const SOURCE_ROOTS = ['src-main', 'src-renderer', 'migrations', 'demo-fixtures'];

/** Every source file of the layers, relative to the repository root. */
export function sourceFiles(root: string): string[] {
  const files: string[] = [];
  const walk = (relative: string): void => {
    for (const entry of readdirSync(path.join(root, relative), { withFileTypes: true })) {
      const child = `${relative}/${entry.name}`;
      if (entry.isDirectory()) walk(child);
      else if (/\.(ts|mts|mjs|svelte)$/.test(entry.name) && !entry.name.endsWith('.d.ts')) files.push(child);
    }
  };
  for (const dir of SOURCE_ROOTS) walk(dir);
  return files.sort();
}

export function arrowProblemsIn(root: string): string[] {
  return sourceFiles(root).flatMap((file) => importsIn(file, readFileSync(path.join(root, file), 'utf8')).flatMap((imp) => arrowProblem(imp) ?? []));
}
