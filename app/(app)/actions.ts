"use server";
import { redirect } from "next/navigation";
import { endCurrentSession } from "@/app/_lib/auth";

export async function signOut(): Promise<void> {
  await endCurrentSession();
  redirect("/sign-in");
}
