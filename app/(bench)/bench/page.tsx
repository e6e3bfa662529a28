import { JobPicker } from "@/components/bench/job-picker";

export const metadata = { title: "Bench" };

export default function BenchHome() {
  return <JobPicker />;
}
