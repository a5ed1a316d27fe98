/** SHA-256 of photo bytes as 64 lowercase hex digits (FIPS 180-4, via the platform's Web Crypto). */
export async function sha256Hex(data: Blob | ArrayBuffer | Uint8Array): Promise<string> {
  const bytes = data instanceof Blob ? await data.arrayBuffer() : data;
  const digest = await crypto.subtle.digest('SHA-256', bytes as BufferSource);
  return Array.from(new Uint8Array(digest), (b) => b.toString(16).padStart(2, '0')).join('');
}

/** The photo's hash: the stored `sha256` when the row has one (schema 5 and later), otherwise computed now. */
export async function photoSha256(row: { sha256?: unknown; blob: Blob }): Promise<string> {
  return typeof row.sha256 === 'string' && /^[0-9a-f]{64}$/.test(row.sha256) ? row.sha256 : sha256Hex(row.blob);
}
