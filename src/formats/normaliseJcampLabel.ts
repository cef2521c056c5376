// Puts a JCAMP-DX label name in its comparable form, as the standard asks: case, spaces, -, _ and / do not count.

export type NormaliseJcampLabelOptions = Record<string, never>;

/** `##Sampling Procedure` and `##SAMPLING_PROCEDURE` both become `SAMPLINGPROCEDURE`; `.` and `$` prefixes stay. */
export function normaliseJcampLabel(label: string, _options: NormaliseJcampLabelOptions = {}): string {
  return label.toUpperCase().replace(/[\s\-_/]+/g, '');
}
