import type { Metadata } from "next";
import { VisitsScreen } from "@/components/site-visits/visits-screen";

export const metadata: Metadata = { title: "Site visits" };

export default function Page() {
  return <VisitsScreen />;
}
