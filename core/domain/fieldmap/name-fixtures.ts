/**
 * The locator speaks in the contract's ids (fixtures, risk points, room walls `<id>:wall:<k>`); the
 * product speaks in the names the lead tech gave them. Swaps every known id in a sentence for its name.
 */
const UUID = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}(:wall:\d+)?/gi;

export function nameFixtures(text: string, labels: ReadonlyMap<string, string>): string {
  return text.replace(UUID, (match, wall: string | undefined) => {
    const id = wall ? match.slice(0, match.length - wall.length) : match;
    const name = labels.get(id.toLowerCase());
    if (!name) return match;
    return wall ? `the wall of ${name}` : name;
  });
}
