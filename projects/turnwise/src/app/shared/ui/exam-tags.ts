import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { Mobility, Precaution } from '@shared/api/plan';

/** The icon of each isolation precaution, shared by every screen that shows one. */
export const PRECAUTION_ICONS: Readonly<Record<Exclude<Precaution, 'none'>, string>> = {
  contact: 'back_hand',
  enteric: 'sanitizer',
  droplet: 'masks',
  airborne: 'air',
};

const MOBILITY_ICONS: Readonly<Record<Mobility, string>> = {
  ambulatory: 'directions_walk',
  wheelchair: 'accessible',
  stretcher: 'airline_seat_flat',
};

interface Tag {
  kind: 'coil' | 'precaution' | 'mobility' | 'contrast';
  icon: string;
  text: string;
}

/**
 * What about an exam changes its turnover (coil, precaution, mobility, contrast), each as icon
 * plus words. Defaults that change nothing (no precaution, no contrast) are left out to keep
 * the list quiet; mobility is always shown because the room team plans around it.
 */
@Component({
  selector: 'tw-exam-tags',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <ul class="tags" aria-label="Exam details">
      @for (tag of tags(); track tag.kind) {
        <li [class]="'tag ' + tag.kind">
          <mat-icon [svgIcon]="tag.icon" aria-hidden="true" />{{ tag.text }}
        </li>
      }
    </ul>
  `,
  styles: `
    .tags { display: flex; flex-wrap: wrap; gap: 4px 12px; margin: 0; padding: 0; list-style: none; }
    .tag { display: inline-flex; align-items: center; gap: 3px; font: var(--mat-sys-body-small); }
    .tag mat-icon { width: 16px; height: 16px; }
    .precaution { font-weight: 600; color: var(--mat-sys-tertiary); }
  `,
})
export class ExamTags {
  readonly coil = input<string | null>(null);
  readonly precaution = input<Precaution>('none');
  readonly mobility = input<Mobility>('ambulatory');
  readonly contrast = input(false);

  protected readonly tags = computed(() => {
    const tags: Tag[] = [];
    const precaution = this.precaution();
    if (precaution !== 'none') {
      tags.push({ kind: 'precaution', icon: PRECAUTION_ICONS[precaution], text: `${precaution} precautions` });
    }
    const coil = this.coil();
    if (coil) tags.push({ kind: 'coil', icon: 'sensors', text: `${coil} coil` });
    tags.push({ kind: 'mobility', icon: MOBILITY_ICONS[this.mobility()], text: this.mobility() });
    if (this.contrast()) tags.push({ kind: 'contrast', icon: 'vaccines', text: 'contrast' });
    return tags;
  });
}
