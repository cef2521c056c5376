// Wraps site data as a classic script that stores it under a key of `window.__bandshelf`: pages load it with a
// <script> tag, which browsers allow from file:// where they refuse fetch/XHR, and no eval is needed (CSP stays strict).
import { jsonForScript } from './jsonForScript.js';

export interface DataScriptOptions {
  /** JSON text already serialised (e.g. an entry's download), used as the value instead of serialising `value`.
   * @default undefined (serialise `value`) */
  json?: string;
}

export function dataScript(key: string, value: unknown, options: DataScriptOptions = {}): string {
  const json = options.json?.trim() ?? jsonForScript(value);
  return `(self.__bandshelf=self.__bandshelf||{})[${JSON.stringify(key)}]=${json};\n`;
}
