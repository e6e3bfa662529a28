"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/client/api";
import type { BearingsView } from "@/lib/schemas/bearings";
import type { BuildPlanView } from "@/lib/schemas/build-plan";
import type { BoardPage } from "@/lib/schemas/job-board";
import type { BoardJob, CustomerRecord, JobDetail, JobLimitsView } from "@/lib/schemas/job";
import type { TemplateRecord, TemplateSummary } from "@/lib/schemas/spec";

// Query keys and fetchers of the desk screens, in one place so every mutation knows what to
// update or invalidate.
export const keys = {
  jobs: ["jobs"] as const,
  job: (id: number) => ["job", id] as const,
  customers: ["customers"] as const,
  specs: ["specs"] as const,
  spec: (id: number) => ["spec", id] as const,
  limits: (id: number) => ["job-limits", id] as const,
  plan: (id: number) => ["build-plan", id] as const,
};

export type { BoardJob, BuildPlanView, CustomerRecord, JobDetail, JobLimitsView, TemplateRecord, TemplateSummary };

/** One page of the board (`params`: the board's query string); the last page stays shown while the next loads. */
export const useJobBoard = (params: string) =>
  useQuery({
    queryKey: [...keys.jobs, params],
    queryFn: () => api<BoardPage>(`/api/jobs?${params}`),
    placeholderData: keepPreviousData,
  });
export const useJob = (id: number) =>
  useQuery({ queryKey: keys.job(id), queryFn: () => api<JobDetail>(`/api/jobs/${id}`) });
export const useCustomers = () =>
  useQuery({
    queryKey: keys.customers,
    queryFn: () => api<{ customers: CustomerRecord[] }>("/api/customers").then((r) => r.customers),
  });
export const useTemplates = () =>
  useQuery({
    queryKey: keys.specs,
    queryFn: () => api<{ templates: TemplateSummary[] }>("/api/specs").then((r) => r.templates),
  });
export const useTemplate = (id: number) =>
  useQuery({
    queryKey: keys.spec(id),
    queryFn: () => api<{ template: TemplateRecord; jobCount: number }>(`/api/specs/${id}`),
  });
export const useJobLimits = (id: number) =>
  useQuery({ queryKey: keys.limits(id), queryFn: () => api<JobLimitsView>(`/api/jobs/${id}/limits`) });
export const useBuildPlan = (id: number) =>
  useQuery({ queryKey: keys.plan(id), queryFn: () => api<BuildPlanView>(`/api/jobs/${id}/build-plan`) });

export const bearingsKey = (id: number) => ["bearings", id] as const;
export const useBearings = (id: number) =>
  useQuery({ queryKey: bearingsKey(id), queryFn: () => api<BearingsView>(`/api/jobs/${id}/bearings`) });
