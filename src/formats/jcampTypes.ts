// Internal shapes of the JCAMP-DX reader: labelled data records and the blocks they form.

/** One labelled data record: `##LABEL= value` plus the lines that follow it up to the next label. */
export interface JcampRecord {
  /** Normalised label (see normaliseJcampLabel). */
  label: string;
  /** The label as written, for messages. */
  rawLabel: string;
  /** Text after `=` on the label line, `$$` comment removed, trimmed. */
  value: string;
  /** 1-based line of the label. */
  line: number;
  /** Index into the file's lines of the first line after the label line. */
  bodyStart: number;
  /** Index one past the last body line. */
  bodyEnd: number;
}

/** A `##TITLE=` … `##END=` block; compound files nest spectrum blocks inside a LINK block. */
export interface JcampBlock {
  records: JcampRecord[];
  parent: JcampBlock | undefined;
  /** 1-based line of the block's `##TITLE=`. */
  line: number;
  closed: boolean;
}
