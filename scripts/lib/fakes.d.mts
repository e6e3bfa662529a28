type Stop = () => Promise<void>;
export function startFakeSmtp(o: {
  port: number;
  mailDir: string;
}): Promise<{ port: number; mailDir: string; stop: Stop }>;
export function startFakeS3(o: {
  port: number;
  dir: string;
  bucket: string;
}): Promise<{ endpoint: string; stop: Stop }>;
export function attachFakeS3(o: { port: number }): Promise<{ endpoint: string; stop: Stop }>;
