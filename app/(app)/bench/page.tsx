import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";
import { BenchApp } from "@/components/bench/BenchApp";

export const metadata: Metadata = { title: "Bench" };

export default async function BenchPage() {
  await guardPage();
  return <BenchApp />;
}
