/**
 * The header Crestline's own client puts on every API request. A cross-site form cannot set a header,
 * and a cross-origin script can set this one only after a CORS preflight, which Crestline never
 * grants; so the server takes it as proof of the request's origin when the browser sent neither
 * Origin nor Referer.
 */
export const CLIENT_HEADER = 'X-Crestline-Client';
export const CLIENT_HEADER_VALUE = '1';
