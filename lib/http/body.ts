/**
 * Reads a request body, stopping as soon as it passes `maxBytes` (a missing or false
 * Content-Length proves nothing), so an oversized body is never held whole in memory. Answers
 * null when the body was too large; the rest of the stream is then cancelled, so that connection
 * cannot be reused and the refusal should say `Connection: close`.
 */
export async function readBodyWithin(
  body: ReadableStream<Uint8Array> | null,
  maxBytes: number,
): Promise<Buffer | null> {
  if (!body) return Buffer.alloc(0);
  const reader = body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => {});
      return null;
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}
