"use client";

// The server's sign-off of a placement and its amendments, with the hash recomputed now (GET
// sign-off route). Online only: the device does not keep signatures.
import { useQuery } from "@tanstack/react-query";
import { callApi } from "@/lib/api/client";

export type SignOffRow = {
  id: string;
  recordType: string;
  recordId: string;
  signerId: string;
  signerName: string | null;
  role: string;
  signedAt: string;
  typedName: string;
  signatureImage: string | null;
  contentHash: string;
};

export type AmendmentRow = {
  id: string;
  version: number;
  what: string;
  why: string;
  authorId: string;
  authorName: string | null;
  createdAt: string;
  signOff: SignOffRow | null;
  matches: boolean | null;
};

export type Verification =
  | { signed: false; amendments: AmendmentRow[] }
  | { signed: true; signOff: SignOffRow; currentHash: string; matches: boolean; amendments: AmendmentRow[] };

export const signOffUrl = (projectId: string, placementId: string) => `/api/projects/${projectId}/placements/${placementId}/sign-off`;
export const amendmentsUrl = (projectId: string, placementId: string) => `/api/projects/${projectId}/placements/${placementId}/amendments`;

export function useVerification(projectId: string, placementId: string, enabled: boolean) {
  return useQuery({
    queryKey: ["sign-off", projectId, placementId],
    enabled,
    staleTime: 0,
    queryFn: async () => {
      const res = await callApi<Verification>(signOffUrl(projectId, placementId));
      if (!res.ok) throw new Error(res.error.message);
      return res.data;
    },
  });
}
