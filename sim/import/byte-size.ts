/**
 * A file's size in MiB (1 MiB = 1024 × 1024 bytes) to one decimal, trailing zero dropped ("2",
 * "3.1"): the words of the upload limit and of a refused file's size, the same in the engine's
 * refusal, the browser's check and the server action's.
 */
export function mebibytesText(bytes: number): string {
  return String(+(bytes / (1024 * 1024)).toFixed(1));
}
