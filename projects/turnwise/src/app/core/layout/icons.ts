import { EnvironmentProviders, inject, provideAppInitializer } from '@angular/core';
import { MatIconRegistry } from '@angular/material/icon';
import { DomSanitizer } from '@angular/platform-browser';

// Only the icons the screens use, bundled as SVG text: no icon font, no request to anyone.
// A screen that needs another icon imports its file here and adds it to ICONS.
import accountCircle from '@material-design-icons/svg/outlined/account_circle.svg';
import barChart from '@material-design-icons/svg/outlined/bar_chart.svg';
import cleaningServices from '@material-design-icons/svg/outlined/cleaning_services.svg';
import error from '@material-design-icons/svg/outlined/error.svg';
import info from '@material-design-icons/svg/outlined/info.svg';
import login from '@material-design-icons/svg/outlined/login.svg';
import logout from '@material-design-icons/svg/outlined/logout.svg';
import meetingRoom from '@material-design-icons/svg/outlined/meeting_room.svg';
import menu from '@material-design-icons/svg/outlined/menu.svg';
import searchOff from '@material-design-icons/svg/outlined/search_off.svg';
import settings from '@material-design-icons/svg/outlined/settings.svg';
import uploadFile from '@material-design-icons/svg/outlined/upload_file.svg';
import viewTimeline from '@material-design-icons/svg/outlined/view_timeline.svg';
import warning from '@material-design-icons/svg/outlined/warning.svg';
import lock from '@material-design-icons/svg/outlined/lock.svg';

/** Icon name (as used in `<mat-icon svgIcon="…">`) → SVG markup. */
export const ICONS: Readonly<Record<string, string>> = {
  account_circle: accountCircle,
  bar_chart: barChart,
  cleaning_services: cleaningServices,
  error,
  info,
  lock,
  login,
  logout,
  meeting_room: meetingRoom,
  menu,
  search_off: searchOff,
  settings,
  upload_file: uploadFile,
  view_timeline: viewTimeline,
  warning,
};

/** Registers every icon in ICONS with Material's icon registry when the app starts. */
export function provideIcons(): EnvironmentProviders {
  return provideAppInitializer(() => {
    const registry = inject(MatIconRegistry);
    const sanitizer = inject(DomSanitizer);
    for (const [name, markup] of Object.entries(ICONS)) {
      // Trusted: the markup is our own bundled file, never user input.
      registry.addSvgIconLiteral(name, sanitizer.bypassSecurityTrustHtml(markup));
    }
  });
}
