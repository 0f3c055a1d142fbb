// Loads an ES-module-only package (file-type, pdfjs-dist) from CommonJS code, under tsx and under jest alike.
import vm from 'node:vm';

type Importer = (specifier: string) => Promise<unknown>;
let importer: Importer | undefined;

/**
 * A real `import()`. TypeScript's CommonJS output turns `await import(x)` into `require(x)`, and jest's module
 * system refuses dynamic imports without --experimental-vm-modules; a script compiled with Node's own
 * default loader (vm.constants.USE_MAIN_CONTEXT_DEFAULT_LOADER, Node 20.12+) does neither.
 */
export function importEsm<T>(specifier: string): Promise<T> {
  if (!importer) {
    const loader = (vm.constants as Record<string, unknown> | undefined)?.['USE_MAIN_CONTEXT_DEFAULT_LOADER'];
    importer = loader ? withoutExperimentalWarning(() => new vm.Script('(specifier) => import(specifier)', { importModuleDynamically: loader as never }).runInThisContext() as Importer) : (new Function('specifier', 'return import(specifier)') as Importer);
  }
  const load = importer;
  return withoutExperimentalWarning(() => load(specifier)) as Promise<T>;
}

// Node flags the loader constant as experimental on every use; the scan CLI's stderr stays quiet.
function withoutExperimentalWarning<T>(create: () => T): T {
  const emitWarning = process.emitWarning;
  process.emitWarning = ((warning: string | Error, ...rest: unknown[]) => {
    const text = typeof warning === 'string' ? warning : warning.message;
    if (!text.includes('USE_MAIN_CONTEXT_DEFAULT_LOADER')) (emitWarning as (...args: unknown[]) => void).call(process, warning, ...rest);
  }) as typeof process.emitWarning;
  try {
    return create();
  } finally {
    process.emitWarning = emitWarning;
  }
}
