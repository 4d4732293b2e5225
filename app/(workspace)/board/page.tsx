import type { Metadata } from "next";
import Link from "next/link";
import { PageTitle } from "@/app/_components/page-title";
import { listBoardCards, listFamiliesWithCurators } from "@/board/queries";
import { boardFilters } from "@/board/schemas";
import { BoardView } from "@/board/ui/board-view";
import { requirePageUser } from "@/lib/auth/guard";
import { BOARD_ROLES } from "@/lib/auth/navigation";

export const metadata: Metadata = { title: "Review board" };
export const dynamic = "force-dynamic";

export default async function BoardPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requirePageUser("/board", [...BOARD_ROLES]);
  const raw = Object.fromEntries(Object.entries(await searchParams).map(([k, v]) => [k, Array.isArray(v) ? v.join(",") : v]));
  // Unusable filters in the address (the proxy already answers a NUL with 400) show the whole board.
  const parsed = boardFilters.safeParse(raw);
  const filters = parsed.success ? parsed.data : boardFilters.parse({});
  const [cards, families] = await Promise.all([listBoardCards(filters, user.id), listFamiliesWithCurators()]);
  return (
    <>
      <div className="flex items-start justify-between gap-4">
        <PageTitle title="Review board" lead="Every proposal, by stage. Drag a card or use its Move to… menu; the server checks every move against the review rules." />
        {user.roles.includes("author") ? (
          <Link href="/proposals/new" className="shrink-0 rounded-md bg-copper px-4 py-2 font-semibold text-white hover:bg-copper-deep">
            New proposal
          </Link>
        ) : null}
      </div>
      <BoardView key={JSON.stringify(filters)} initial={{ cards, families }} viewer={{ id: user.id, roles: user.roles }} filters={filters} />
    </>
  );
}
