export const DEMO_PASSWORD: string;
export const DEMO_ACCOUNTS: { role: 'owner' | 'office' | 'technician'; email: string; name: string }[];
