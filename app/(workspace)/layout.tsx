import { AppShell } from "@/app/_components/app-shell";
import { currentUser } from "@/lib/auth/guard";

export const dynamic = "force-dynamic";

/** Pages inside check access themselves (requirePageUser); the shell only needs to know who is here. */
export default async function WorkspaceLayout({ children }: { children: React.ReactNode }) {
  const user = await currentUser();
  if (!user) return <>{children}</>;
  return <AppShell user={user}>{children}</AppShell>;
}
