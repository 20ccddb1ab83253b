/** Sample buffers the engine accepts: Float64 for exactness, Float32 as stored on the server. */
export type Samples = Float64Array | Float32Array;
