import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeChemical, makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';
import { mockXhrThroughFetch } from '../../../test/xhr-mock';

const manager = makeUser({ role: 'manager' });
const acetone = makeChemical({ id: 5, name: 'Acetone', ghsPictograms: ['GHS02', 'GHS07'] });

function routes(sdsAnswer: { status: number; body: unknown }) {
  mockXhrThroughFetch();
  return mockFetch({
    'GET /api/auth/me': { body: { user: manager } },
    'GET /api/chemicals/5': { body: { ...acetone, sds: null } },
    'GET /api/stock': { body: page([]) },
    'GET /api/containers': { body: page([]) },
    'POST /api/chemicals/5/sds': sdsAnswer,
  });
}

async function uploadSds(file: File) {
  const user = userEvent.setup();
  renderApp('/stock/chemicals/5');
  await screen.findByRole('heading', { name: 'Safety data sheet' }, { timeout: 5000 });
  await user.upload(screen.getByTestId('pdf-file-input'), file);
}

async function uploadAlert() {
  const title = await screen.findByText('The safety data sheet was not uploaded');
  const alert = title.closest('[role="alert"]');
  expect(alert).not.toBeNull();
  return alert as HTMLElement;
}

describe('SDS upload', () => {
  it('when the file is too large (413), then the person is told so with the limit', async () => {
    routes({
      status: 413,
      body: {
        error: {
          code: 'payload_too_large',
          message: 'The file is larger than the upload limit of 20 MB.',
        },
      },
    });
    await uploadSds(new File(['%PDF-1.7'], 'sds.pdf', { type: 'application/pdf' }));
    const alert = await uploadAlert();
    expect(alert).toHaveTextContent('too large');
    expect(alert).toHaveTextContent('20 MB');
  });

  it('when the file is not a PDF (415), then the person is told only PDF files are taken', async () => {
    routes({
      status: 415,
      body: {
        error: {
          code: 'unsupported_media_type',
          message: 'The safety data sheet must be a PDF file; the content of this one is not.',
        },
      },
    });
    await uploadSds(new File(['MZ'], 'sds.pdf', { type: 'application/pdf' }));
    const alert = await uploadAlert();
    expect(alert).toHaveTextContent('Only PDF files can be uploaded here.');
  });

  it('when the upload is accepted, then the chemical is read again and the file is shown', async () => {
    let stored = false;
    mockXhrThroughFetch();
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'GET /api/chemicals/5': () => ({
        body: {
          ...acetone,
          sds: stored
            ? {
                fileName: 'acetone-sds.pdf',
                size: 245_760,
                contentType: 'application/pdf',
                uploadedAt: '2026-11-30T10:00:00.000Z',
              }
            : null,
        },
      }),
      'GET /api/stock': { body: page([]) },
      'GET /api/containers': { body: page([]) },
      'POST /api/chemicals/5/sds': () => {
        stored = true;
        return { status: 201, body: acetone };
      },
    });
    await uploadSds(new File(['%PDF-1.7'], 'acetone-sds.pdf', { type: 'application/pdf' }));
    expect(await screen.findByText('acetone-sds.pdf')).toBeInTheDocument();
    expect(screen.getByText(/240 KB/)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Download' })).toHaveAttribute(
      'href',
      '/api/chemicals/5/sds',
    );
    expect(screen.getByRole('button', { name: 'Replace safety data sheet' })).toBeInTheDocument();
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({ file: 'acetone-sds.pdf' });
  });
});
