export type PackageLinkProps = { href: string };

/** The whole version as one checksummed zip (a BagIt bag), fetched through the review link. */
export function PackageLink({ href }: PackageLinkProps) {
  return (
    <div className="flex flex-wrap items-center justify-between gap-3 rounded-lg border border-slate-200 bg-white px-4 py-3 text-sm">
      <p className="text-slate-800">
        Every file of this version with its metadata record, a README and SHA-256 checksums, in one zip package (a BagIt bag that
        any BagIt tool can check).
      </p>
      <a href={href} download className="rounded-md bg-copper-600 px-3 py-2 font-semibold text-white hover:bg-copper-700">Download the package (zip)</a>
    </div>
  );
}
