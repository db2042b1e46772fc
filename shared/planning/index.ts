// Stored planning data → the rotation engine's requests, shared by the browser and the server.
export * from './request';
export * from './words';
