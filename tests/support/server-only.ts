// Stands in for the server-only marker package under vitest (which is not a React server).
export {};
