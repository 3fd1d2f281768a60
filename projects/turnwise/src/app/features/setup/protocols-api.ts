import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import type {
  EffectPreview,
  NewProtocolVersionInput,
  ProductAnswer,
  ProductInput,
  ProductList,
  ProductView,
  ProtocolList,
  ProtocolPreviewInput,
  ProtocolVersionAnswer,
  SetupChecklist,
} from '@shared/api/protocols';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/**
 * Setup's calls for products, protocols and the setup checklist (admin). Like SetupApi, every
 * call shows its own errors: the dialogs put a 422's problems beside their fields.
 */
@Injectable({ providedIn: 'root' })
export class ProtocolsApi {
  private readonly http = inject(HttpClient);
  private readonly own = { context: showsOwnErrors() };

  products(): Observable<ProductView[]> {
    return this.http.get<ProductList>('/api/products', this.own).pipe(map((r) => r.products));
  }
  createProduct(product: ProductInput): Observable<ProductAnswer> {
    return this.http.post<ProductAnswer>('/api/products', product, this.own);
  }
  updateProduct(id: number, product: ProductInput): Observable<ProductAnswer> {
    return this.http.put<ProductAnswer>(`/api/products/${id}`, product, this.own);
  }
  retireProduct(id: number): Observable<ProductAnswer> {
    return this.http.post<ProductAnswer>(`/api/products/${id}/retire`, {}, this.own);
  }
  previewProduct(id: number, product: ProductInput): Observable<EffectPreview> {
    return this.http.post<EffectPreview>(`/api/products/${id}/preview`, product, this.own);
  }

  protocols(): Observable<ProtocolList> {
    return this.http.get<ProtocolList>('/api/protocols', this.own);
  }
  protocolVersion(modality: string, version: number): Observable<ProtocolVersionAnswer> {
    return this.http.get<ProtocolVersionAnswer>(`/api/protocols/${encodeURIComponent(modality)}/versions/${version}`, this.own);
  }
  saveProtocol(input: NewProtocolVersionInput): Observable<ProtocolVersionAnswer> {
    return this.http.post<ProtocolVersionAnswer>('/api/protocols', input, this.own);
  }
  previewProtocol(input: ProtocolPreviewInput): Observable<EffectPreview> {
    return this.http.post<EffectPreview>('/api/protocols/preview', input, this.own);
  }

  checklist(): Observable<SetupChecklist> {
    return this.http.get<SetupChecklist>('/api/setup/checklist', this.own);
  }
}
