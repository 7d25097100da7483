// Vitest runs server modules outside React's server environment, where the real
// `server-only` package throws on import. The guard itself is checked by
// tests/unit/server-only-guard.test.ts, which reads the files as text.
export {};
