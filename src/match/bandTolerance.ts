// The one default of the band-position search's tolerance, shared by `bandshelf bands`, searchBands and the site.

/** A stored peak within this many cm⁻¹ of a query band matches it (common practice for condensed-phase mid-IR
 * band positions, whose tables quote bands to a few cm⁻¹). */
export const BAND_TOLERANCE_CM1 = 4;
