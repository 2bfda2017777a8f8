import { fireEvent, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { errorBody, signedInAs, stubFetch, type FakeReply } from '../../../test/fake-api';
import { fakeLoop } from '../../../test/registry-fixtures';
import { renderApp } from '../../../test/render-app';

const LOOP = fakeLoop();

async function uploadFiles(reply: FakeReply) {
  const sent: FormData[] = [];
  stubFetch({
    ...signedInAs(['engineer']),
    [`GET /api/v1/loops/${LOOP.id}`]: { body: LOOP },
    [`POST /api/v1/loops/${LOOP.id}/model-uploads`]: ({ init }) => (sent.push(init.body as FormData), reply),
  });
  renderApp(`/models/${LOOP.id}/new`);
  fireEvent.click(await screen.findByRole('tab', { name: 'Upload files' }));
  const files = [
    new File(['1,0,0\n0,1,0\n0,0,1'], 'Ac.csv', { type: 'text/csv' }),
    new File(['1\n0\n0'], 'Bc.csv', { type: 'text/csv' }),
  ];
  fireEvent.change(screen.getByLabelText('Model files'), { target: { files } });
  fireEvent.click(screen.getByRole('button', { name: 'Read the files into the editor' }));
  return sent;
}

describe('uploading model files', () => {
  it('sends the files as one multipart form and fills the editor with what was read', async () => {
    const sent = await uploadFiles({
      body: {
        source: 'continuous',
        Ac: [
          [-0.01, 0, 0],
          [0, -0.02, 0],
          [0, 0, -0.03],
        ],
        Bc: [[0.5], [0], [0]],
      },
    });
    expect(await screen.findByText('Filled Ac, Bc from the uploaded files. Check them below, then save.')).toBeTruthy();
    expect(screen.getByRole('tab', { name: 'Continuous model' }).getAttribute('aria-selected')).toBe('true');
    const ac = screen.getByRole('table', { name: 'Matrix Ac' });
    expect((within(ac).getAllByRole('textbox')[4] as HTMLInputElement).value).toBe('-0.02');
    expect(sent[0].getAll('files').map((file) => (file as File).name)).toEqual(['Ac.csv', 'Bc.csv']);
  });

  it('lists every problem with its file, row and column', async () => {
    await uploadFiles({
      status: 400,
      body: errorBody('invalid_upload', 'The files have 2 problems.', [
        { file: 'Ac.csv', row: 2, column: 3, message: '“x” is not a number' },
        { file: null, row: null, column: null, message: 'Bc.csv is missing' },
      ]),
    });
    const table = await screen.findByRole('table', { name: 'Problems in the uploaded files' });
    const rows = within(table)
      .getAllByRole('row')
      .slice(1)
      .map((row) => row.textContent);
    expect(rows).toEqual(['Ac.csv23“x” is not a number', 'all files——Bc.csv is missing']);
    expect(screen.getByText(/The files were not read: 2 problems to fix/)).toBeTruthy();
  });
});
