// Puts a JCAMP-DX label name in its comparable form, as the standard asks: case, spaces, -, _ and / do not count.

/** `##Sampling Procedure` and `##SAMPLING_PROCEDURE` both become `SAMPLINGPROCEDURE`; `.` and `$` prefixes stay. */
export function normaliseJcampLabel(label: string): string {
  return label.toUpperCase().replace(/[\s\-_/]+/g, '');
}
