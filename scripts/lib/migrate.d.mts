export function migrate(root: string, databaseUrl: string): Promise<void>;
