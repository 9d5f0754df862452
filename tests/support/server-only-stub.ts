// Stand-in for the 'server-only' guard under vitest, where the react-server condition is absent.
export {};
