"use client";
// A submitted attempt: "verifying" until the worker's replay lands (polled through the attempt's
// route handler with SWR), then the official result, feedback per window and the review.
import { useEffect, type ReactNode } from "react";
import useSWR from "swr";
import type { AttemptDetail } from "@/app/_lib/classroom/contracts";
import { AttemptReview } from "./AttemptReview";

const fetcher = async (url: string): Promise<AttemptDetail> => {
  const r = await fetch(url, { cache: "no-store" });
  if (!r.ok) throw new Error(`the attempt could not be loaded (${r.status})`);
  return r.json();
};

export function AttemptOutcome({ initial, compareWith, compareOptions, feedbackForm }: { initial: AttemptDetail; compareWith: AttemptDetail | null; compareOptions: { id: string; label: string }[]; feedbackForm: ReactNode }) {
  const { data, mutate } = useSWR(`/api/attempts/${initial.id}`, fetcher, {
    fallbackData: initial,
    // SWR passes the cached data, which is empty until the first fetch (the fallback is not cached)
    refreshInterval: (d) => (!d || d.status === "verifying" ? 1500 : 0),
    revalidateOnFocus: true,
  });
  // a server action on this page (written feedback) re-renders it with a fresh `initial`: take it
  useEffect(() => {
    void mutate(initial, { revalidate: false });
  }, [initial, mutate]);
  const attempt = data ?? initial;
  return <AttemptReview attempt={attempt} compareWith={compareWith} compareOptions={compareOptions} feedbackForm={feedbackForm} />;
}
