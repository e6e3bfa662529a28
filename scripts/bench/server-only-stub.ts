// bench:sync runs the route handler in plain Node (as the integration tests do), where the real
// "server-only" marker throws; scripts/bench/tsconfig.sync.json points the import here instead.
// (The react-server condition that db-setup uses is no help: route handlers import next/navigation,
// which needs React's client build.)
export {};
