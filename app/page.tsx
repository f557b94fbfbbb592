import { redirect } from "next/navigation";
import { currentSession } from "./_lib/auth";

export default async function Home() {
  redirect((await currentSession()).user ? "/dashboard" : "/sign-in");
}
