// Serialises data for a `<script type="application/json">` block so no value can close the block or open markup.

export interface JsonForScriptOptions {
  /** Indentation passed to JSON.stringify.
   * @default undefined (compact) */
  space?: number;
}

/**
 * JSON with `<`, `>`, `&`, U+2028 and U+2029 written as \u escapes: a metadata string holding `</script>` or
 * `<!--` then stays inside the string, and JSON.parse in the page restores it unchanged. Non-finite numbers are
 * written as null (JSON has no NaN), which the page reads as "not covered".
 */
export function jsonForScript(value: unknown, options: JsonForScriptOptions = {}): string {
  const json = JSON.stringify(value, null, options.space) ?? 'null';
  return json.replace(/[<>&\u2028\u2029]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}
