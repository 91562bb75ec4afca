// Packing of a test's readings into blobs: little-endian Float32 (level, temperature) and
// Float64 (irregular time offsets). Copies on the way out, since a blob from the driver need
// not be aligned for a typed-array view.

export function packFloat32(values: Float32Array): Buffer {
  return Buffer.from(values.buffer, values.byteOffset, values.byteLength);
}

export function packFloat64(values: Float64Array): Buffer {
  return Buffer.from(values.buffer, values.byteOffset, values.byteLength);
}

export function unpackFloat32(blob: Buffer): Float32Array {
  const copy = new Uint8Array(blob.byteLength);
  copy.set(blob);
  return new Float32Array(copy.buffer);
}

export function unpackFloat64(blob: Buffer): Float64Array {
  const copy = new Uint8Array(blob.byteLength);
  copy.set(blob);
  return new Float64Array(copy.buffer);
}
