import { InterchangeError } from './types';

/** Largest recipe file we read: a large BeerXML library of a few hundred recipes fits well under it. */
export const MAX_IMPORT_BYTES = 2 * 1024 * 1024;

/** Refuses text longer than the limit, counted in UTF-8 bytes. */
export function assertWithinLimit(text: string, maxBytes = MAX_IMPORT_BYTES): void {
  // A cheap upper bound first: a UTF-8 character takes at most 3 bytes per UTF-16 unit.
  if (text.length * 3 <= maxBytes) return;
  const bytes = new TextEncoder().encode(text).length;
  if (bytes > maxBytes) {
    throw new InterchangeError(
      `The file is ${formatMb(bytes)}; the largest we read is ${formatMb(maxBytes)}.`,
      '',
      'too_large',
    );
  }
}

function formatMb(bytes: number): string {
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}
