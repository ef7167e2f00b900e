export function backupDatabase(databaseUrl: string, file: string): string;
export function restoreDatabase(databaseUrl: string, file: string): void;
