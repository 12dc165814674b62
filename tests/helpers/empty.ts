// Stands in for the "server-only" marker package under vitest (it throws outside React's server build).
export {};
