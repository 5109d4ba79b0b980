/** Types of engine-bundle.mjs (plain JavaScript, run by worker threads without a TypeScript loader). */
export interface EngineBundleManifest {
  version: number;
  /** The build's folder inside the cache folder. */
  build: string;
  /** The source files the build read, relative to the repository's root. */
  inputs: string[];
}
export interface LoadedEngineBundle {
  exports: unknown;
  build: string;
  /** Writes V8's code cache beside the bundle once, after the first task ran. */
  writeCodeCache(): void;
}
export declare const root: string;
export declare const defaultCacheDir: string;
export declare function freshManifest(cacheDir?: string): EngineBundleManifest | null;
export declare function buildEngineBundle(cacheDir?: string): Promise<EngineBundleManifest>;
/** A fresh manifest, building the bundle first when there is none or a source is newer. */
export declare function ensureEngineBundle(cacheDir?: string): Promise<EngineBundleManifest>;
export declare function loadEngineBundle(manifest: EngineBundleManifest, cacheDir?: string): LoadedEngineBundle;
