import { DATASET_IDS, DATASETS, EDITORS, priceBookSettingsSchema, type DataRole } from '@calc';
import { z } from 'zod';
import {
  companyDataHistoryResponse,
  companyDataRowResponse,
  companyDataTableResponse,
  companyDataTablesResponse,
  importApplyResponse,
  importPreviewResponse,
  PRICE_SETTINGS_ROLES,
  priceBookSettingsResponse,
} from '@contract';
import { ANY_STAFF, OFFICE, rawResponse, roles, type ApiRouter } from '../../lib/route';
import { applyImport, exportCsv, previewImport, templateCsv } from './company-data.import';
import { presentChange, presentRow } from './company-data.presenter';
import { datasetParams, importApplyBody, importPreviewBody, recordBody, rowParams } from './company-data.schema';
import { assertReader, createRow, getRow, listRows, rowHistory, updateRow } from './company-data.service';
import { getSettings, presentSettings, putSettings } from './price-book-settings.service';

const PRICE_READERS = roles(...PRICE_SETTINGS_ROLES);

/** The equipment catalog and price book: /api/company-data/... */
export function companyDataRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/tables',
    policy: ANY_STAFF,
    response: companyDataTablesResponse,
    handler: async ({ actor }) => ({
      tables: DATASET_IDS.filter((id) => DATASETS[id].readers.includes(actor.role as DataRole)).map((id) => ({
        id,
        label: DATASETS[id].label,
        canEdit: EDITORS.includes(actor.role as DataRole),
      })),
    }),
  });
  api.route({
    method: 'get',
    path: '/settings',
    policy: PRICE_READERS,
    response: priceBookSettingsResponse,
    versioned: (out) => out.settings.version,
    handler: async ({ em, actor }) => ({
      settings: presentSettings(await getSettings(em, actor.companyId), actor.role),
    }),
  });
  api.route({
    method: 'put',
    path: '/settings',
    policy: OFFICE,
    body: z.strictObject({ settings: priceBookSettingsSchema.strict() }),
    response: priceBookSettingsResponse,
    versioned: (out) => out.settings.version,
    handler: async ({ service, actor, body, ifMatch }) => ({
      settings: presentSettings(await putSettings(service, ifMatch, body.settings), actor.role),
    }),
  });
  api.route({
    method: 'get',
    path: '/:dataset',
    policy: ANY_STAFF,
    params: datasetParams,
    response: companyDataTableResponse,
    handler: async ({ service, actor, params }) => {
      assertReader(actor, params.dataset);
      const rows = await listRows(service, params.dataset);
      return { dataset: params.dataset, rows: rows.map((r) => presentRow(r, actor.role)) };
    },
  });
  api.route({
    method: 'get',
    path: '/:dataset/csv/export',
    policy: OFFICE,
    params: datasetParams,
    response: rawResponse('text/csv'),
    handler: async ({ service, params, res }) => {
      const csv = await exportCsv(service, params.dataset);
      res.type('text/csv; charset=utf-8').attachment(`${params.dataset}.csv`).send(csv);
      return undefined;
    },
  });
  api.route({
    method: 'get',
    path: '/:dataset/csv/template',
    policy: OFFICE,
    params: datasetParams,
    response: rawResponse('text/csv'),
    handler: async ({ service, params, res }) => {
      res
        .type('text/csv; charset=utf-8')
        .attachment(`${params.dataset}-template.csv`)
        .send(await templateCsv(service, params.dataset));
      return undefined;
    },
  });
  api.route({
    method: 'post',
    path: '/:dataset/import/preview',
    policy: OFFICE,
    params: datasetParams,
    body: importPreviewBody,
    response: importPreviewResponse,
    handler: async ({ service, params, body }) => ({
      preview: await previewImport(service, params.dataset, body.csv),
    }),
  });
  api.route({
    method: 'post',
    path: '/:dataset/import/apply',
    policy: OFFICE,
    params: datasetParams,
    body: importApplyBody,
    response: importApplyResponse,
    handler: async ({ service, params, body }) => ({
      applied: await applyImport(service, params.dataset, body.csv, body.token),
    }),
  });
  api.route({
    method: 'post',
    path: '/:dataset',
    policy: OFFICE,
    params: datasetParams,
    body: recordBody,
    status: 201,
    response: companyDataRowResponse,
    versioned: (out) => out.row.version,
    handler: async ({ service, actor, params, body }) => ({
      row: presentRow(await createRow(service, params.dataset, body.record), actor.role),
    }),
  });
  api.route({
    method: 'get',
    path: '/:dataset/:key',
    policy: ANY_STAFF,
    params: rowParams,
    response: companyDataRowResponse,
    versioned: (out) => out.row.version,
    handler: async ({ service, actor, params }) => {
      assertReader(actor, params.dataset);
      return { row: presentRow(await getRow(service, params.dataset, params.key), actor.role) };
    },
  });
  api.route({
    method: 'put',
    path: '/:dataset/:key',
    policy: OFFICE,
    params: rowParams,
    body: recordBody,
    response: companyDataRowResponse,
    versioned: (out) => out.row.version,
    handler: async ({ service, actor, params, body, ifMatch }) => ({
      row: presentRow(await updateRow(service, params.dataset, params.key, ifMatch, body.record), actor.role),
    }),
  });
  api.route({
    method: 'get',
    path: '/:dataset/:key/history',
    policy: OFFICE,
    params: rowParams,
    response: companyDataHistoryResponse,
    handler: async ({ service, params }) => ({
      history: (await rowHistory(service, params.dataset, params.key)).map(presentChange),
    }),
  });
}
