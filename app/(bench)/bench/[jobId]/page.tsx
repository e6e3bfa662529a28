import { redirect } from "next/navigation";

// Older links (/bench/12) lead to the job shell that works offline (/bench/job?id=12).
export default async function BenchJobLink({ params }: { params: Promise<{ jobId: string }> }) {
  const { jobId } = await params;
  redirect(/^\d{1,10}$/.test(jobId) ? `/bench/job?id=${jobId}` : "/bench");
}
