import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { NgControl } from '@angular/forms';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatRadioGroupHarness } from '@angular/material/radio/testing';
import { MatSelect } from '@angular/material/select';
import { By } from '@angular/platform-browser';
import type { AdminSponsorRow } from '@contracts/sponsors/sponsor-answers';
import { CreditDialog, type CreditDialogData } from './credit-dialog';

const sponsor = { id: 7, slug: 'voltwhistle-electronics', name: 'Voltwhistle Electronics' } as AdminSponsorRow;
const line = (id: number, kind: string, promised: number, delivered: number, dueOn: string) => ({
  id,
  kind,
  promised,
  delivered,
  dueOn,
  overdue: false,
  listedNow: false,
});
const ledger = {
  agreements: [
    {
      id: 2,
      season: '2027',
      deliverables: [line(31, 'build_log_credit', 2, 0, '2027-06-30')],
      byKind: [],
      overdue: [],
      nextDue: null,
    },
    {
      id: 1,
      season: '2026',
      deliverables: [
        line(11, 'build_log_credit', 1, 1, '2026-05-31'),
        line(12, 'build_log_credit', 3, 1, '2026-12-31'),
        line(13, 'video_mention', 1, 0, '2026-10-31'),
      ],
      byKind: [],
      overdue: [],
      nextDue: null,
    },
  ],
};

describe('CreditDialog', () => {
  const close = jest.fn();
  beforeEach(() => {
    close.mockReset();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MatDialogRef, useValue: { close } },
        { provide: MAT_DIALOG_DATA, useValue: { sponsors: [sponsor] } satisfies CreditDialogData },
      ],
    });
  });

  /**
   * Opens the dialog, picks the sponsor and answers the ledger request; returns the promise choice. The sponsor is
   * set through the select's form control: a harness would wait for the app to settle, which the pending ledger
   * request keeps it from doing until it is answered.
   */
  const pickSponsor = async () => {
    const fixture = TestBed.createComponent(CreditDialog);
    fixture.detectChanges();
    fixture.debugElement.query(By.directive(MatSelect)).injector.get(NgControl).control!.setValue(sponsor.id);
    fixture.detectChanges();
    TestBed.inject(HttpTestingController).expectOne('/api/admin/sponsors/7/ledger').flush(ledger);
    const harness = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    return { fixture, harness, choice: await harness.getHarness(MatRadioGroupHarness) };
  };

  it('should offer the open build-log promises, earliest due first and preselected', async () => {
    const { choice } = await pickSponsor();
    const labels = await Promise.all((await choice.getRadioButtons()).map((r) => r.getLabelText()));
    expect(labels).toEqual([
      '2026 build log credits: 1 of 3 delivered, due Dec 31, 2026',
      '2027 build log credits: 0 of 2 delivered, due Jun 30, 2027',
    ]);
    expect(await choice.getCheckedValue()).toBe('12');
  });

  it('should insert a marker naming the promise the editor chose', async () => {
    const { harness, choice } = await pickSponsor();
    await choice.checkRadioButton({ label: /2027/ });
    await (await harness.getHarness(MatButtonHarness.with({ text: 'Insert thank-you card' }))).click();
    expect(close).toHaveBeenCalledWith('%thanks voltwhistle-electronics #31');
  });

  it('should name the preselected earliest promise when the editor leaves the choice', async () => {
    const { harness } = await pickSponsor();
    await (await harness.getHarness(MatButtonHarness.with({ text: 'Insert thank-you card' }))).click();
    expect(close).toHaveBeenCalledWith('%thanks voltwhistle-electronics #12');
  });
});
