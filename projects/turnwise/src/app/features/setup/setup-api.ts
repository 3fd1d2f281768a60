import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import type { AuditPage } from '@shared/api/audit';
import type { EquipmentInput, EquipmentItem } from '@shared/api/equipment';
import type { RoomInput, SetupRoom } from '@shared/api/rooms';
import type { SiteSettings } from '@shared/api/settings';
import type { UserAccount } from '@shared/api/users';
import type { Role } from '@shared/api/auth';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

export interface NewUserInput {
  username: string;
  displayName: string;
  email: string;
  role: Role;
  password: string;
}

/**
 * Setup's calls (admin). Every call shows its own errors: forms put a 422's problems beside
 * their fields, lists put a refusal in their own message.
 */
@Injectable({ providedIn: 'root' })
export class SetupApi {
  private readonly http = inject(HttpClient);
  private readonly own = { context: showsOwnErrors() };

  rooms(): Observable<SetupRoom[]> {
    return this.http.get<{ rooms: SetupRoom[] }>('/api/rooms/setup', this.own).pipe(map((r) => r.rooms));
  }
  createRoom(room: RoomInput): Observable<SetupRoom> {
    return this.http.post<{ room: SetupRoom }>('/api/rooms', room, this.own).pipe(map((r) => ({ ...r.room, retired: false, retiredAt: null })));
  }
  updateRoom(id: number, room: RoomInput): Observable<SetupRoom> {
    return this.http.put<{ room: SetupRoom }>(`/api/rooms/${id}`, room, this.own).pipe(map((r) => r.room));
  }
  retireRoom(id: number): Observable<SetupRoom> {
    return this.http.post<{ room: SetupRoom }>(`/api/rooms/${id}/retire`, {}, this.own).pipe(map((r) => r.room));
  }
  restoreRoom(id: number): Observable<SetupRoom> {
    return this.http.post<{ room: SetupRoom }>(`/api/rooms/${id}/restore`, {}, this.own).pipe(map((r) => r.room));
  }
  setKit(roomId: number, equipmentIds: number[]): Observable<EquipmentItem[]> {
    return this.http.put<{ kit: EquipmentItem[] }>(`/api/rooms/${roomId}/kit`, { equipmentIds }, this.own).pipe(map((r) => r.kit));
  }

  equipment(): Observable<EquipmentItem[]> {
    return this.http.get<{ equipment: EquipmentItem[] }>('/api/equipment', this.own).pipe(map((r) => r.equipment));
  }
  createEquipment(item: EquipmentInput): Observable<EquipmentItem> {
    return this.http.post<{ item: EquipmentItem }>('/api/equipment', item, this.own).pipe(map((r) => r.item));
  }
  updateEquipment(id: number, item: EquipmentInput): Observable<EquipmentItem> {
    return this.http.put<{ item: EquipmentItem }>(`/api/equipment/${id}`, item, this.own).pipe(map((r) => r.item));
  }
  retireEquipment(id: number): Observable<EquipmentItem> {
    return this.http.post<{ item: EquipmentItem }>(`/api/equipment/${id}/retire`, {}, this.own).pipe(map((r) => r.item));
  }

  users(): Observable<UserAccount[]> {
    return this.http.get<{ users: UserAccount[] }>('/api/users', this.own).pipe(map((r) => r.users));
  }
  createUser(user: NewUserInput): Observable<UserAccount> {
    return this.http.post<{ user: UserAccount }>('/api/users', user, this.own).pipe(map((r) => r.user));
  }
  changeUser(id: number, change: { displayName?: string; email?: string; role?: Role }): Observable<UserAccount> {
    return this.http.patch<{ user: UserAccount }>(`/api/users/${id}`, change, this.own).pipe(map((r) => r.user));
  }
  resetPassword(id: number, password: string): Observable<UserAccount> {
    return this.http.post<{ user: UserAccount }>(`/api/users/${id}/password`, { password }, this.own).pipe(map((r) => r.user));
  }
  setActive(id: number, active: boolean): Observable<UserAccount> {
    return this.http.post<{ user: UserAccount }>(`/api/users/${id}/${active ? 'reactivate' : 'deactivate'}`, {}, this.own).pipe(map((r) => r.user));
  }

  settings(): Observable<SiteSettings> {
    return this.http.get<{ settings: SiteSettings }>('/api/settings', this.own).pipe(map((r) => r.settings));
  }
  saveSettings(settings: SiteSettings): Observable<SiteSettings> {
    return this.http.put<{ settings: SiteSettings }>('/api/settings', settings, this.own).pipe(map((r) => r.settings));
  }

  audit(page: { limit: number; offset: number }): Observable<AuditPage> {
    return this.http.get<AuditPage>(`/api/audit?limit=${page.limit}&offset=${page.offset}`, this.own);
  }
}
