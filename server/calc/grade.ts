/**
 * EN 50131-1: a system's grade is that of its lowest-graded component, so one grade 2 keypad
 * makes a grade 3 design a grade 2 system.
 */
export interface GradedComponent {
  label: string;
  grade: number | null;
}

export interface SystemGrade {
  /** Null while nothing has a grade recorded. */
  grade: number | null;
  /** The components that set the grade (all at the lowest). */
  limitedBy: string[];
  /** Components without a grade: the system grade cannot be confirmed until they have one. */
  ungraded: string[];
}

export function systemGrade(components: GradedComponent[]): SystemGrade {
  const graded = components.filter((component) => component.grade !== null) as {
    label: string;
    grade: number;
  }[];
  const ungraded = components
    .filter((component) => component.grade === null)
    .map((component) => component.label);
  if (graded.length === 0) return { grade: null, limitedBy: [], ungraded };
  const grade = Math.min(...graded.map((component) => component.grade));
  return {
    grade,
    limitedBy: graded.filter((component) => component.grade === grade).map((c) => c.label),
    ungraded,
  };
}

/**
 * The environmental class a location needs (EN 50131-1 classes I–IV): indoor heated I,
 * indoor general II, outdoor sheltered or indoor extremes III, outdoor general IV. Locations
 * are read from their words (common practice, no source); anything else needs the site's class.
 */
const OUTDOOR = /\b(outside|outdoor|external|exterior|elevation|eaves|garden|driveway|gate)\b/i;
const SHELTERED = /\b(porch|carport|canopy|outbuilding|shed|barn|stable)\b/i;
const UNHEATED =
  /\b(garage|loft|attic|cellar|basement|conservatory|store ?room|workshop|boathouse)\b/i;

export function requiredClassFor(
  location: string,
  siteClass: number,
): { required: number; why: string } {
  if (OUTDOOR.test(location)) return { required: 4, why: 'outdoors' };
  if (SHELTERED.test(location))
    return { required: Math.max(3, siteClass), why: 'outdoors but sheltered' };
  if (UNHEATED.test(location))
    return { required: Math.max(2, siteClass), why: 'indoors but unheated' };
  return { required: siteClass, why: "the site's class" };
}

export interface ClassedComponent {
  label: string;
  location: string;
  environmentalClass: number | null;
}

export interface ClassMismatch {
  label: string;
  location: string;
  environmentalClass: number;
  required: number;
  why: string;
}

export function environmentalMismatches(
  components: ClassedComponent[],
  siteClass: number,
): ClassMismatch[] {
  return components.flatMap((component) => {
    if (component.environmentalClass === null) return [];
    const { required, why } = requiredClassFor(component.location, siteClass);
    return component.environmentalClass < required
      ? [{ ...component, environmentalClass: component.environmentalClass, required, why }]
      : [];
  });
}

export const ROMAN = ['', 'I', 'II', 'III', 'IV'] as const;
