import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { useSearchParams } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { Button } from '../../../components/ui/button';
import { PageHeader } from '../../../components/ui/page-header';
import { usePlantClock } from '../../../features/alerts/hooks/use-plant-time-zone';
import { areasQueryOptions } from '../../../features/loops/api/get-areas';
import { peopleQueryOptions } from '../../../features/rota/api/get-people';
import { shiftsQueryOptions } from '../../../features/rota/api/get-shifts';
import { AreaEngineersList } from '../../../features/rota/components/area-engineers-list';
import { EscalationTimings } from '../../../features/rota/components/escalation-timings';
import { OnCallNowSummary } from '../../../features/rota/components/on-call-now-summary';
import { ShiftDialog, type ShiftDialogState } from '../../../features/rota/components/shift-dialog';
import { WeekGrid, type RotaRow } from '../../../features/rota/components/week-grid';
import { newShiftValues, valuesOfShift } from '../../../features/rota/utils/shift-form';
import { addDays, dayLabel, isPlantDate, mondayOf, plantDateOf, weekDays } from '../../../features/rota/utils/week';
import { hasRole } from '../../../features/session/roles';
import { useSignedInUser } from '../../../features/session/use-signed-in-user';
import { useNow } from '../../../lib/use-now';
import { PageSection } from '../../../components/ui/page-section';

function useRotaWeek(timeZone: string) {
  const [params, setParams] = useSearchParams();
  const today = plantDateOf(useNow(60_000), timeZone);
  const asked = params.get('week');
  const monday = mondayOf(isPlantDate(asked) ? asked : today);
  const goTo = (date: string) => setParams(date === mondayOf(today) ? {} : { week: date }, { replace: true });
  return { today, monday, days: weekDays(monday, timeZone), goTo };
}

export function RotaPage() {
  const user = useSignedInUser();
  const mayEdit = hasRole(user, 'oncall') || hasRole(user, 'admin');
  const { timeZone, settled } = usePlantClock();
  const { today, monday, days, goTo } = useRotaWeek(timeZone);
  // The week's edges depend on the plant's zone: asked for once the loops have told it.
  const shifts = useQuery({
    ...shiftsQueryOptions(new Date(days[0].startMs).toISOString(), new Date(days[6].endMs).toISOString()),
    enabled: settled,
  });
  const areas = useQuery(areasQueryOptions());
  const people = useQuery({ ...peopleQueryOptions(), enabled: mayEdit });
  const [dialog, setDialog] = useState<ShiftDialogState | null>(null);
  const areaList = areas.data ?? [];
  const unlisted = [...new Set((shifts.data ?? []).map((s) => s.area))].filter(
    (area): area is string => area !== null && !areaList.some((a) => a.id === area),
  );
  const rows: RotaRow[] = [
    { area: null, name: 'Plant-wide' },
    ...areaList.map((area) => ({ area: area.id, name: area.name })),
    ...unlisted.map((area) => ({ area, name: area })),
  ];
  const openNew = () =>
    setDialog({
      shift: null,
      initial: newShiftValues(monday <= today && today <= addDays(monday, 6) ? today : monday, timeZone),
    });

  return (
    <div className="space-y-6">
      <PageHeader
        title="Rota"
        description={`Who is on call, when, and for which area. Times are plant time (${timeZone}).`}
        actions={
          mayEdit ? (
            <Button variant="primary" onClick={openNew}>
              Add a shift
            </Button>
          ) : null
        }
      />
      <OnCallNowSummary areas={areaList} />
      <PageSection title="Week">
        <div className="flex flex-wrap items-center gap-2">
          <p className="mr-auto font-medium">
            Week of {dayLabel(monday)} {monday.slice(0, 4)}
          </p>
          <Button onClick={() => goTo(addDays(monday, -7))}>Previous week</Button>
          <Button onClick={() => goTo(mondayOf(today))}>This week</Button>
          <Button onClick={() => goTo(addDays(monday, 7))}>Next week</Button>
        </div>
        {shifts.isError ? (
          <ErrorNotice error={shifts.error} onRetry={() => void shifts.refetch()} />
        ) : (
          <WeekGrid
            rows={rows}
            days={days}
            today={today}
            shifts={shifts.data ?? []}
            timeZone={timeZone}
            onOpen={mayEdit ? (shift) => setDialog({ shift, initial: valuesOfShift(shift, timeZone) }) : undefined}
          />
        )}
        {shifts.data?.length === 0 ? (
          <p className="text-sm text-ink/80">
            Nobody is on the rota this week.{' '}
            {mayEdit
              ? 'Add a shift to say who is called when a loop diverges.'
              : 'On-call engineers and administrators add the shifts.'}{' '}
            Without a shift, alert e-mails reach nobody.
          </p>
        ) : null}
        <p className="text-xs text-ink/70">
          Primary shifts are filled, secondary shifts outlined with a dashed line; both say their position in words. An
          area&apos;s own shift takes over from the plant-wide one for that area.
          {mayEdit
            ? ' Choose a shift to change, swap or delete it.'
            : ' Changing the rota needs the on-call or administrator role.'}
        </p>
      </PageSection>
      <PageSection title="Area engineers">
        <AreaEngineersList areas={areaList} />
      </PageSection>
      <PageSection title="Escalation timings">
        <EscalationTimings mayEdit={hasRole(user, 'admin')} />
      </PageSection>
      {dialog ? (
        <ShiftDialog
          {...dialog}
          people={people.data ?? []}
          areas={areaList}
          weekShifts={shifts.data ?? []}
          timeZone={timeZone}
          onClose={() => setDialog(null)}
        />
      ) : null}
    </div>
  );
}
