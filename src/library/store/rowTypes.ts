// Row shapes of the library tables as better-sqlite3 returns them (internal to src/library).
import type { FileRole, RevisionKind } from '../types.js';

export interface RevisionRow {
  key: number;
  entry_id: string;
  revision: number;
  kind: RevisionKind;
  content_hash: string;
  data_hash: string;
  read_options: string;
  recipe: string;
  meta: string;
  original_x: Buffer;
  original_y: Buffer;
  processed: Buffer;
  covered_points: number;
  coverage_min: number | null;
  coverage_max: number | null;
  peaks: Buffer;
  qc: string;
  extras: string;
  author: string;
  message: string;
  created_at: string;
  record_hash: string;
}

export interface RevisionFileRow {
  revision_key: number;
  position: number;
  role: FileRole;
  name: string;
  sha256: string;
}
