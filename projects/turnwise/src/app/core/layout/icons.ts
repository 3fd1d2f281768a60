import { EnvironmentProviders, provideEnvironmentInitializer } from '@angular/core';

import { IconSet, registerIcons } from './register-icons';

// Only the icons the signed-in screens use, bundled as SVG text: no icon font, no request to
// anyone. The shell registers them (see Shell), so they load with it, not with the sign-in page.
// A screen that needs another icon imports its file here and adds it to ICONS.
import accountCircle from '@material-design-icons/svg/outlined/account_circle.svg';
import barChart from '@material-design-icons/svg/outlined/bar_chart.svg';
import cleaningServices from '@material-design-icons/svg/outlined/cleaning_services.svg';
import error from '@material-design-icons/svg/outlined/error.svg';
import info from '@material-design-icons/svg/outlined/info.svg';
import logout from '@material-design-icons/svg/outlined/logout.svg';
import meetingRoom from '@material-design-icons/svg/outlined/meeting_room.svg';
import outbox from '@material-design-icons/svg/outlined/outbox.svg';
import menu from '@material-design-icons/svg/outlined/menu.svg';
import settings from '@material-design-icons/svg/outlined/settings.svg';
import uploadFile from '@material-design-icons/svg/outlined/upload_file.svg';
import viewTimeline from '@material-design-icons/svg/outlined/view_timeline.svg';
import warning from '@material-design-icons/svg/outlined/warning.svg';
import lock from '@material-design-icons/svg/outlined/lock.svg';
// Import and Day plan: verdicts, exam tags, day navigation, the drop zone.
import accessible from '@material-design-icons/svg/outlined/accessible.svg';
import air from '@material-design-icons/svg/outlined/air.svg';
import airlineSeatFlat from '@material-design-icons/svg/outlined/airline_seat_flat.svg';
import backHand from '@material-design-icons/svg/outlined/back_hand.svg';
import checkCircle from '@material-design-icons/svg/outlined/check_circle.svg';
import chevronLeft from '@material-design-icons/svg/outlined/chevron_left.svg';
import chevronRight from '@material-design-icons/svg/outlined/chevron_right.svg';
import cloudUpload from '@material-design-icons/svg/outlined/cloud_upload.svg';
import directionsWalk from '@material-design-icons/svg/outlined/directions_walk.svg';
import eventBusy from '@material-design-icons/svg/outlined/event_busy.svg';
import expandLess from '@material-design-icons/svg/outlined/expand_less.svg';
import expandMore from '@material-design-icons/svg/outlined/expand_more.svg';
import group from '@material-design-icons/svg/outlined/group.svg';
import masks from '@material-design-icons/svg/outlined/masks.svg';
import sanitizer from '@material-design-icons/svg/outlined/sanitizer.svg';
import schedule from '@material-design-icons/svg/outlined/schedule.svg';
import sensors from '@material-design-icons/svg/outlined/sensors.svg';
import timelapse from '@material-design-icons/svg/outlined/timelapse.svg';
import today from '@material-design-icons/svg/outlined/today.svg';
import vaccines from '@material-design-icons/svg/outlined/vaccines.svg';
import edit from '@material-design-icons/svg/outlined/edit.svg';
import addCircle from '@material-design-icons/svg/outlined/add_circle.svg';
import removeCircle from '@material-design-icons/svg/outlined/remove_circle.svg';
// Rooms now and Turnover: room states, arrivals, wall display, live status, checklist and log.
import sensorOccupied from '@material-design-icons/svg/outlined/sensor_occupied.svg';
import waterDrop from '@material-design-icons/svg/outlined/water_drop.svg';
import noMeetingRoom from '@material-design-icons/svg/outlined/no_meeting_room.svg';
import howToReg from '@material-design-icons/svg/outlined/how_to_reg.svg';
import undo from '@material-design-icons/svg/outlined/undo.svg';
import fullscreen from '@material-design-icons/svg/outlined/fullscreen.svg';
import fullscreenExit from '@material-design-icons/svg/outlined/fullscreen_exit.svg';
import sync from '@material-design-icons/svg/outlined/sync.svg';
import syncProblem from '@material-design-icons/svg/outlined/sync_problem.svg';
import taskAlt from '@material-design-icons/svg/outlined/task_alt.svg';
import receiptLong from '@material-design-icons/svg/outlined/receipt_long.svg';
import download from '@material-design-icons/svg/outlined/download.svg';
import checklist from '@material-design-icons/svg/outlined/checklist.svg';
import eventAvailable from '@material-design-icons/svg/outlined/event_available.svg';
// Day plan timeline: redo, history, closing panels, suggested fixes, the live indicator.
import redo from '@material-design-icons/svg/outlined/redo.svg';
import history from '@material-design-icons/svg/outlined/history.svg';
import close from '@material-design-icons/svg/outlined/close.svg';
import autoFixHigh from '@material-design-icons/svg/outlined/auto_fix_high.svg';
import fiberManualRecord from '@material-design-icons/svg/outlined/fiber_manual_record.svg';
import cloudOff from '@material-design-icons/svg/outlined/cloud_off.svg';
// Day plan: copying the patients to call, stepping from one problem gap to the next.
import contentCopy from '@material-design-icons/svg/outlined/content_copy.svg';
import arrowBack from '@material-design-icons/svg/outlined/arrow_back.svg';
import arrowForward from '@material-design-icons/svg/outlined/arrow_forward.svg';
// Gap verdict "fits" (a check of its own: ready's is check_circle); the exam block's menu.
import done from '@material-design-icons/svg/outlined/done.svg';
import moreVert from '@material-design-icons/svg/outlined/more_vert.svg';
// The day sheet: printing it.
import print from '@material-design-icons/svg/outlined/print.svg';
// The interface log (HL7 booking feed).
import syncAlt from '@material-design-icons/svg/outlined/sync_alt.svg';

/** Every icon drawn under the shell: its toolbar and navigation, the screens and their shared pieces. */
export const ICONS: IconSet = {
  account_circle: accountCircle,
  bar_chart: barChart,
  cleaning_services: cleaningServices,
  error,
  info,
  lock,
  logout,
  meeting_room: meetingRoom,
  menu,
  outbox,
  settings,
  upload_file: uploadFile,
  view_timeline: viewTimeline,
  warning,
  accessible,
  air,
  airline_seat_flat: airlineSeatFlat,
  back_hand: backHand,
  check_circle: checkCircle,
  chevron_left: chevronLeft,
  chevron_right: chevronRight,
  cloud_upload: cloudUpload,
  directions_walk: directionsWalk,
  event_busy: eventBusy,
  expand_less: expandLess,
  expand_more: expandMore,
  group,
  masks,
  sanitizer,
  schedule,
  sensors,
  timelapse,
  today,
  vaccines,
  edit,
  add_circle: addCircle,
  remove_circle: removeCircle,
  sensor_occupied: sensorOccupied,
  water_drop: waterDrop,
  no_meeting_room: noMeetingRoom,
  how_to_reg: howToReg,
  undo,
  fullscreen,
  fullscreen_exit: fullscreenExit,
  sync,
  sync_problem: syncProblem,
  task_alt: taskAlt,
  receipt_long: receiptLong,
  download,
  checklist,
  event_available: eventAvailable,
  redo,
  history,
  close,
  auto_fix_high: autoFixHigh,
  fiber_manual_record: fiberManualRecord,
  cloud_off: cloudOff,
  content_copy: contentCopy,
  arrow_back: arrowBack,
  arrow_forward: arrowForward,
  done,
  more_vert: moreVert,
  print,
  sync_alt: syncAlt,
};

/** Registers a set of icons (by default every icon in ICONS) when an injector is created: for specs. */
export function provideIcons(icons: IconSet = ICONS): EnvironmentProviders {
  return provideEnvironmentInitializer(() => registerIcons(icons));
}
