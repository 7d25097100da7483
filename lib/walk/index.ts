// The walk's pure core, used by the phone and the server alike.
export * from './apply-utterance';
export * from './check-input';
export * from './progress';
export * from './report';
export * from './severity';
export { sha256Hex } from './sha256';
export * from './step';
export * from './zones';
export * from './name-finding';
