// Tests run server modules directly; the real "server-only" marker throws outside React Server Components.
export {};
