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

/**
 * Reads a request body stream as text, stopping as soon as it passes `maxBytes`, so an
 * oversized upload is refused without ever being held whole in memory.
 */
export async function readLimitedText(stream: ReadableStream<Uint8Array> | null, maxBytes: number): Promise<string> {
  if (!stream) return '';
  const reader = stream.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel();
      throw new InterchangeError(`The upload is larger than ${formatMb(maxBytes)}.`, '', 'too_large');
    }
    chunks.push(value);
  }
  const joined = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    joined.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return new TextDecoder('utf-8').decode(joined);
}

function formatMb(bytes: number): string {
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}
