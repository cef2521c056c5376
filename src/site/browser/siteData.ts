// Reads data the site ships as script files (see dataScript.ts): loads the script once with a <script> tag, which
// works from file:// as well as from a server, and resolves with the value it stored.

export interface SiteDataOptions {
  /** The document to add the script tag to.
   * @default globalThis.document */
  doc?: Document;
}

type Store = Record<string, unknown>;
const store = (): Store => {
  const g = globalThis as { __bandshelf?: Store };
  g.__bandshelf ??= {};
  return g.__bandshelf;
};

/** `src` is relative to the page; `key` is the one the script stores its value under. */
export function siteData<T>(src: string, key: string, options: SiteDataOptions = {}): Promise<T> {
  if (key in store()) return Promise.resolve(store()[key] as T);
  const doc = options.doc ?? globalThis.document;
  return new Promise<T>((resolve, reject) => {
    const script = doc.createElement('script');
    script.src = src;
    script.addEventListener('load', () => {
      if (key in store()) resolve(store()[key] as T);
      else reject(new Error(`${src} did not hold ${key}`));
    });
    script.addEventListener('error', () => reject(new Error(`${src} could not be loaded`)));
    doc.head.append(script);
  });
}
