/** What a photo belongs to: a student's write-up, or a practical (the teacher's reference photos). */
export type EvidenceTarget = { writeUpId: string } | { practicalId: string };

/** One photo as GET /api/evidence sends it; the two links expire within minutes. */
export type EvidencePhotoJson = {
  id: string;
  caption: string;
  status: "pending" | "ready" | "rejected";
  width: number | null;
  height: number | null;
  size: number | null;
  sha256: string | null;
  confirmedAt: string | null;
  rejectReason: string | null;
  canDelete: boolean;
  thumbUrl: string;
  imageUrl: string;
};

/** POST /api/evidence: where the browser sends the file. */
export type UploadStartJson = { id: string; uploadUrl: string; method: "PUT"; headers: Record<string, string> };
