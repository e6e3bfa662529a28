"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/client/api";
import type {
  ReleaseJobSummary,
  ReleaseRecord,
  ReleaseView,
  ReopenInput,
  SignInput,
  Verification,
} from "@/lib/schemas/release";

// Query keys, fetchers and mutations of the release screens. A sign or a reopen refreshes the
// page's data, its verification and the job list, so nothing on screen is stale afterwards.
export const releaseKeys = {
  jobs: ["release-jobs"] as const,
  view: (jobId: number) => ["release", jobId] as const,
  verify: (jobId: number) => ["release-verify", jobId] as const,
};

export const useReleaseJobs = () =>
  useQuery({
    queryKey: releaseKeys.jobs,
    queryFn: () => api<{ jobs: ReleaseJobSummary[] }>("/api/release").then((r) => r.jobs),
  });

export const useReleaseView = (jobId: number) =>
  useQuery({ queryKey: releaseKeys.view(jobId), queryFn: () => api<ReleaseView>(`/api/release/${jobId}`) });

export const useVerification = (jobId: number, enabled: boolean) =>
  useQuery({
    queryKey: releaseKeys.verify(jobId),
    queryFn: () => api<Verification>(`/api/release/${jobId}/verify`),
    enabled,
    staleTime: 0,
  });

function useRefresh(jobId: number) {
  const qc = useQueryClient();
  return () =>
    Promise.all([
      qc.invalidateQueries({ queryKey: releaseKeys.view(jobId) }),
      qc.invalidateQueries({ queryKey: releaseKeys.verify(jobId) }),
      qc.invalidateQueries({ queryKey: releaseKeys.jobs }),
    ]);
}

export function useSign(jobId: number) {
  const refresh = useRefresh(jobId);
  return useMutation({
    mutationFn: (input: SignInput) =>
      api<{ release: ReleaseRecord }>(`/api/release/${jobId}`, { method: "POST", json: input }),
    onSuccess: refresh,
  });
}

export function useReopen(jobId: number) {
  const refresh = useRefresh(jobId);
  return useMutation({
    mutationFn: (input: ReopenInput) =>
      api<{ release: ReleaseRecord }>(`/api/release/${jobId}/reopen`, { method: "POST", json: input }),
    onSuccess: refresh,
  });
}
