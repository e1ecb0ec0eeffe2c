/** File-system failures in a few plain words, for one-line messages. */

/** Why a path cannot be used, in a few words. */
export function describeFsError(error: unknown): string {
  const code = (error as NodeJS.ErrnoException | undefined)?.code;
  switch (code) {
    case 'ENOENT':
    case 'ENOTDIR':
      return 'no such file or folder';
    case 'EACCES':
    case 'EPERM':
      return 'permission denied';
    case 'ELOOP':
      return 'too many symbolic links';
    case 'EISDIR':
      return 'is a folder';
    default:
      return code ?? (error instanceof Error ? error.message : String(error));
  }
}
