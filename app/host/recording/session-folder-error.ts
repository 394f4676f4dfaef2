/**
 * A session folder that cannot be used as asked: not empty where a new session should go,
 * not a session, or being recorded by another process. The message names the folder.
 */
export class SessionFolderError extends Error {
  override name = 'SessionFolderError';

  constructor(
    readonly dir: string,
    readonly problem: string,
  ) {
    super(`${dir}: ${problem}`);
  }
}
