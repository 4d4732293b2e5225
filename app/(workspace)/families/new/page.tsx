import type { Metadata } from "next";
import { PageTitle } from "@/app/_components/page-title";
import { requirePageUser } from "@/lib/auth/guard";
import { NewFamilyForm } from "./new-family-form";

export const metadata: Metadata = { title: "Open a model family" };

export default async function NewFamilyPage() {
  await requirePageUser("/families/new", ["curator"]);
  return (
    <>
      <PageTitle title="Open a model family" lead="A new material or model line. You become its curator; its first proposal starts from a blank model." />
      <NewFamilyForm />
    </>
  );
}
