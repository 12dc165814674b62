import { strToU8, zipSync, type Zippable } from "fflate";
import { exportOwnData } from "@/db/queries/privacy";
import { handle } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";

const README = `Your data from Meniscus

personal-data.json  everything Meniscus holds about you: your account, classes, family links,
                    write-ups (with marks and feedback once returned), progress, calculation
                    checks, the history of changes to your account and work, and the e-mails
                    Meniscus sent you.
photos/             the photos added to your write-ups, as stored (re-encoded without location
                    or camera data).

Ask your school if anything here is wrong, or if you want it deleted.
`;

/**
 * "Download everything held about me": a zip of the signed-in person's own data and photos.
 * There is no id in the address: nobody can ask for someone else's.
 */
export const GET = handle(async () => {
  const actor = await requireApiUser();
  const now = new Date();
  const { data, files } = await exportOwnData({ actor, now });
  const entries: Zippable = { "README.txt": strToU8(README), "personal-data.json": strToU8(JSON.stringify(data, null, 2)) };
  for (const f of files) entries[f.path] = [new Uint8Array(f.bytes), { level: 0 }];
  const zip = zipSync(entries, { level: 6, mtime: now });
  const slug = actor.name.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "") || "account";
  return new Response(new Uint8Array(zip), {
    headers: {
      "content-type": "application/zip",
      "content-disposition": `attachment; filename="meniscus-data-${slug}-${now.toISOString().slice(0, 10)}.zip"`,
      "cache-control": "private, no-store",
    },
  });
});
