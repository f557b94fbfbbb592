/**
 * A file's size in MiB (1 MiB = 1024 × 1024 bytes) to three significant figures, trailing zeros
 * dropped ("2", "3.1", "2.04"): the words of the upload limit and of a refused file's size, the
 * same in the engine's refusal, the browser's check and the server action's. Three figures, so a
 * file just over the limit never reads as the limit itself.
 */
export function mebibytesText(bytes: number): string {
  return String(+(bytes / (1024 * 1024)).toPrecision(3));
}
