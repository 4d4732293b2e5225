import { listBoardCards, listFamiliesWithCurators } from "@/board/queries";
import { boardFilters } from "@/board/schemas";
import { requireRole } from "@/lib/auth/guard";
import { BOARD_ROLES } from "@/lib/auth/navigation";
import { AppError, fieldErrorsOf } from "@/lib/errors";
import { handleRoute } from "@/lib/http";

export const dynamic = "force-dynamic";

/** GET /api/board?family=a,b&stage=draft,submitted&mine=assigned|authored&author=<id> — the board's cards (SWR). */
export const GET = handleRoute(async (request: Request) => {
  const parsed = boardFilters.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!parsed.success) throw new AppError("invalid:filter", "The board filters have problems.", fieldErrorsOf(parsed.error));
  const user = await requireRole(...BOARD_ROLES);
  const filters = parsed.data;
  const [cards, families] = await Promise.all([listBoardCards(filters, user.id), listFamiliesWithCurators()]);
  return Response.json({ cards, families });
});
