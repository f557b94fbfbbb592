"use client";
// Binds the attempt Bench to the submit server action and shows the "verifying" view after it.
import { useRouter } from "next/navigation";
import type { ActionResult } from "@/app/_lib/action";
import { AttemptBench, type AttemptLaunch } from "./AttemptBench";

type Action = (previous: ActionResult, form: FormData) => Promise<ActionResult>;

export function AttemptRunner({ launch, submitAction }: { launch: AttemptLaunch; submitAction: Action }) {
  const router = useRouter();
  const submit = async (payload: string) => {
    const form = new FormData();
    form.set("payload", payload);
    const r = await submitAction({ ok: true }, form);
    return r.ok ? { ok: true as const, message: r.message } : { ok: false as const, error: r.error };
  };
  return <AttemptBench launch={launch} submit={submit} onSubmitted={() => router.refresh()} />;
}
