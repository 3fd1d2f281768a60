import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatChipsModule } from '@angular/material/chips';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';

import {
  FALLBACK_MODALITY,
  MOBILITY_LEVELS,
  PRECAUTION_LEVELS,
  type ModalityProtocols,
  type ProductView,
  type ProtocolStepFields,
  type ProtocolVersionView,
} from '@shared/api/protocols';

export interface ProtocolViewData {
  protocols: ModalityProtocols;
  /** The version shown first. */
  version: number;
  products: readonly ProductView[];
  today: string;
}

type Adjustment = { step: string; addMinutes?: number; setMinutes?: number };

/** One modality's protocol versions, read-only: any version (scheduled, current, past) with every step. */
@Component({
  selector: 'tw-protocol-view',
  imports: [MatDialogModule, MatButtonModule, MatChipsModule, MatFormFieldModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './protocol-view.html',
  styleUrl: './protocol-view.scss',
})
export class ProtocolView {
  protected readonly data = inject<ProtocolViewData>(MAT_DIALOG_DATA);
  protected readonly modalityName = this.data.protocols.modality === FALLBACK_MODALITY ? 'fallback (*)' : this.data.protocols.modality;
  protected readonly levels = PRECAUTION_LEVELS;
  protected readonly mobilities = MOBILITY_LEVELS;
  /** Newest first: scheduled, current, superseded. */
  protected readonly versions: ProtocolVersionView[] = [
    ...[...this.data.protocols.future].reverse(),
    ...(this.data.protocols.current ? [this.data.protocols.current] : []),
    ...this.data.protocols.history,
  ];
  protected readonly chosen = signal(this.data.version);
  protected readonly shown = computed(() => this.versions.find((v) => v.version === this.chosen()) ?? this.versions[0]!);

  protected status(version: ProtocolVersionView): string {
    if (version === this.data.protocols.current) return 'current';
    return version.effectiveFrom > this.data.today ? 'scheduled' : 'superseded';
  }

  protected product(id: number | null): string {
    if (id === null) return 'the default product';
    const found = this.data.products.find((p) => p.id === id);
    return found ? `${found.name} (${found.contactMinutes} min contact)` : `product ${id}`;
  }

  /** "2 min hands-on, disinfects with …, then 1 min dry". */
  protected summary(step: ProtocolStepFields): string {
    const parts = [`${step.handsOnMinutes} min hands-on`];
    if (step.disinfects) parts.push(`disinfects with ${this.product(step.productId)}`);
    if (step.dryMinutes > 0) parts.push(`then ${step.dryMinutes} min dry`);
    if (step.afterAllOthers) parts.push('after every other step');
    return parts.join(', ');
  }

  protected needs(step: ProtocolStepFields, steps: readonly ProtocolStepFields[]): string[] {
    return step.needs.map((need) => {
      const label = steps.find((s) => s.key === need.key)?.label ?? need.key;
      return need.dry ? `after ${label} is dry` : `after ${label}`;
    });
  }

  protected conditions(step: ProtocolStepFields): string {
    const when = step.onlyWhen;
    const parts: string[] = [];
    if (when.contrast !== undefined) parts.push(when.contrast ? 'contrast exam next' : 'no contrast next');
    if (when.coilChange !== undefined) parts.push(when.coilChange ? 'coil change' : 'no coil change');
    if (when.mobility) parts.push(`leaving patient ${when.mobility.join(' or ')}`);
    if (when.precaution) parts.push(`after ${when.precaution.join(' or ')} precautions`);
    return parts.length > 0 ? `Only when: ${parts.join('; ')}` : '';
  }

  protected adjustment(a: Adjustment, steps: readonly ProtocolStepFields[]): string {
    const label = steps.find((s) => s.key === a.step)?.label ?? a.step;
    return a.setMinutes !== undefined ? `${label}: ${a.setMinutes} min` : `${label}: +${a.addMinutes} min`;
  }

  protected mobilityAdjustments(version: ProtocolVersionView, mobility: (typeof MOBILITY_LEVELS)[number]): Adjustment[] {
    return version.body.mobility[mobility];
  }
}
