// Builds the CLI bundle once so integration tests spawn the same `bandshelf` a user gets.
// @ts-expect-error: the build script is plain JavaScript without a declaration.
import { buildAll } from '../src/cli/build.mjs';

export async function setup(): Promise<void> {
  await buildAll();
}
