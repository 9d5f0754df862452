// Types of the parts of postgres.mjs that TypeScript scripts use (`npm run load -- --restart-db`).
export function ensurePostgres(options: { name: string; port: number; database: string; fresh?: boolean }): Promise<{ url: string; adminUrl: string; stop: () => void; startedHere: boolean }>;
export function stopPostgres(name: string): void;
