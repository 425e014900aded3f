/** How every screen and file names a stratum to people: "Coastal heath (HEA)", or the name alone when it has no code. */
export function stratumLabel(name: string, code?: string | null): string {
  return code ? `${name} (${code})` : name;
}
