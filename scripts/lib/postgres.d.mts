export function dropDatabase(client: { query(sql: string): Promise<unknown> }, database: string, attempts?: number): Promise<void>;
export function withDatabase(url: string, database: string): string;
