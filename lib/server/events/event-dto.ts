import 'server-only';
import type { Event } from '@/models';
import type { EventInput } from '@/lib/core/inputs/events';

export type EventDto = EventInput & {
  id: string;
  organisationId: string;
  slug: string;
  severalClassesPerBoat: boolean;
};

export function toEventDto(e: Event): EventDto {
  return {
    id: e.id,
    organisationId: e.organisationId,
    slug: e.slug,
    name: e.name,
    venue: e.venue,
    startsOn: e.startsOn,
    endsOn: e.endsOn,
    timeZone: e.timeZone,
    status: e.status,
    waterKind: e.waterKind,
    waterTemperatureC: e.waterTemperatureC,
    waterDensityKgM3: e.waterDensityKgM3 ?? null,
    protestWindowMinutes: e.protestWindowMinutes,
    appealNoticeMinutes: e.appealNoticeMinutes,
    currency: e.currency as EventDto['currency'],
    entryFeeMinor: e.entryFeeMinor,
    protestFeeMinor: e.protestFeeMinor,
    severalClassesPerBoat: e.severalClassesPerBoat,
    appealFeeMinor: e.appealFeeMinor,
  };
}
