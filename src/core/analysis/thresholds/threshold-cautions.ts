/**
 * Cautions that travel with every threshold distance (DOMAIN.md §4.5, common practice
 * unless flagged there). Worded for people; the report shows all of them whenever a
 * threshold or an exposure level is shown.
 */
export const thresholdCautions: readonly string[] = [
  'Not medical advice: a threshold distance is an estimate for screening, not a clearance for any person or device; local codes, the implant or device maker\'s instructions and licensed clinical practice come first.',
  'Exposure guidelines (ICNIRP 2009 static fields, Health Physics 96(4):504–514; ICNIRP 2010, Health Physics 99(6):818–836; IEEE C95.1-2019) are not device specifications and not therapy dosing; they do not apply to a patient\'s intended exposure, which is a matter for licensed clinical practice and the device maker\'s instructions.',
  'A threshold distance is a model estimate from a limited survey: read it with its 95 % interval, its datum (where distance is measured from), its direction (on the coil axis; off axis near the windings the field can be higher) and the detector type (rms or peak).',
  'People with pacemakers, ICDs, neurostimulators, insulin pumps or cochlear implants should follow their device maker\'s guidance, their clinician\'s advice and local codes; 0.5 mT is a screening line, not a guarantee.',
  'Pulsed devices: an rms reading can be far below the peak (crest factor 10–30 at 1 %–0.1 % duty); compare like with like.',
  'Close to the windings the field changes steeply: a 1 mm placement error moves a reading by several per cent.',
  'ringfall is not a calibrated compliance instrument; a formal assessment needs calibrated equipment and the applicable standard.',
  'Hot coils and high-voltage pulse drivers are burn and shock hazards; measure with the device in its normal enclosure.',
];
