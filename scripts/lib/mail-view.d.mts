export function startMailView(o: {
  port: number;
  mailDir: string;
}): Promise<{ url: string; stop: () => Promise<void> }>;
