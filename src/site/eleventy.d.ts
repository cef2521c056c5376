// The small part of Eleventy 3's programmatic API bandshelf uses; the package ships no type declarations.
declare module '@11ty/eleventy' {
  /** The configuration object Eleventy hands to a config function or plugin. */
  export interface EleventyUserConfig {
    addGlobalData(name: string, value: unknown): void;
    addFilter(name: string, filter: (...args: never[]) => unknown): void;
    addPlugin<T>(plugin: (config: EleventyUserConfig, options: T) => void, options?: T): void;
    setTemplateFormats(formats: string | string[]): void;
    setUseGitIgnore(enabled: boolean): void;
    setQuietMode(quiet: boolean): void;
    setNunjucksEnvironmentOptions(options: Record<string, unknown>): void;
    setDataDeepMerge(enabled: boolean): void;
    ignores: Set<string>;
    /** Eleventy's own timing groups (not a documented API; used only to keep its slow-filter notes quiet). */
    benchmarks?: { config?: { setIsVerbose?: (verbose: boolean) => void } };
  }

  export interface EleventyOptions {
    quietMode?: boolean;
    /** false: read no config file from the working directory. */
    configPath?: string | false;
    pathPrefix?: string;
    config?: (config: EleventyUserConfig) => void | Promise<void>;
  }

  export class Eleventy {
    constructor(input?: string, output?: string, options?: EleventyOptions);
    write(): Promise<unknown>;
    disableLogger(): void;
  }
}
