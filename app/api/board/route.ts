import { listBoardCards, listFamiliesWithCurators } from "@/board/queries";
import { boardFilters } from "@/board/schemas";
import { requireRole } from "@/lib/auth/guard";
import { BOARD_ROLES } from "@/lib/auth/navigation";
import { handleRoute } from "@/lib/http";

export const dynamic = "force-dynamic";

/** GET /api/board?family=a,b&stage=draft,submitted&mine=assigned|authored&author=<id> — the board's cards (SWR). */
export const GET = handleRoute(async (request: Request) => {
  const filters = boardFilters.parse(Object.fromEntries(new URL(request.url).searchParams));
  const user = await requireRole(...BOARD_ROLES);
  const [cards, families] = await Promise.all([listBoardCards(filters, user.id), listFamiliesWithCurators()]);
  return Response.json({ cards, families });
});
