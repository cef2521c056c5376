// Who a revision or review is by when no `--author` / `--reviewer` is given: $BANDSHELF_AUTHOR, else the OS user.
import { userInfo } from 'node:os';

export function defaultAuthor(env: NodeJS.ProcessEnv = process.env): string {
  const fromEnv = env.BANDSHELF_AUTHOR?.trim();
  if (fromEnv) return fromEnv;
  try {
    return userInfo().username || 'unknown';
  } catch {
    // Containers without a passwd entry for the uid have no user name.
    return 'unknown';
  }
}
