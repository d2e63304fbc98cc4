import { loadConfig } from '../../server/config';

const base = { NODE_ENV: 'test', DATA_DIR: '/tmp/padside-config-storage-test', SESSION_SECRET: 'x'.repeat(40) };
const s3 = {
  ...base,
  STORAGE_URL: 's3://padside-media/club-site',
  S3_ENDPOINT: 'https://objects.example.net',
  S3_REGION: 'ca-central-1',
  S3_ACCESS_KEY_ID: 'PADSIDEEXAMPLEKEY',
  S3_SECRET_ACCESS_KEY: 'example-secret-not-real',
};

describe('loadConfig: where uploads are stored', () => {
  it('keeps the disk under DATA_DIR when STORAGE_URL is unset, even with stray S3 settings', () => {
    expect(loadConfig({ ...base, S3_ENDPOINT: 'http://127.0.0.1:9000' }).storage).toEqual({
      kind: 'disk',
      dir: '/tmp/padside-config-storage-test/uploads',
    });
  });

  it('reads an s3:// address with its bucket, prefix and settings', () => {
    expect(loadConfig(s3).storage).toEqual({
      kind: 's3',
      bucket: 'padside-media',
      prefix: 'club-site/',
      endpoint: 'https://objects.example.net',
      region: 'ca-central-1',
      accessKeyId: 'PADSIDEEXAMPLEKEY',
      secretAccessKey: 'example-secret-not-real',
      forcePathStyle: false,
    });
  });

  it.each([
    ['s3://padside-media', ''],
    ['s3://padside-media/', ''],
    ['s3://padside-media/a/b/', 'a/b/'],
  ])('takes %s as prefix "%s"', (url, prefix) => {
    expect(loadConfig({ ...s3, STORAGE_URL: url }).storage).toMatchObject({ bucket: 'padside-media', prefix });
  });

  it.each([
    ['true', true],
    ['1', true],
    ['false', false],
    ['0', false],
  ])('reads S3_FORCE_PATH_STYLE=%s as %s (path-style for self-hosted servers)', (value, expected) => {
    expect(loadConfig({ ...s3, S3_FORCE_PATH_STYLE: value }).storage).toMatchObject({ forcePathStyle: expected });
  });

  it.each([
    ['STORAGE_URL', 'https://padside-media/x', 'STORAGE_URL must look like s3://bucket'],
    ['STORAGE_URL', 's3://Padside_Media', 'STORAGE_URL must look like s3://bucket'],
    ['STORAGE_URL', 's3://ab', 'STORAGE_URL must look like s3://bucket'],
    ['STORAGE_URL', 's3://padside..media', 'does not allow'],
    ['STORAGE_URL', 's3://192.168.10.20', 'does not allow'],
    ['S3_ENDPOINT', 'objects.example.net', 'S3_ENDPOINT must be an http(s) URL'],
    ['S3_ENDPOINT', 'ftp://objects.example.net', 'S3_ENDPOINT must be an http(s) URL'],
    ['S3_REGION', 'Canada Central', 'S3_REGION must be a region name'],
    ['S3_FORCE_PATH_STYLE', 'yes', 'S3_FORCE_PATH_STYLE must be true or false'],
  ])('refuses to start with %s=%s', (name, value, message) => {
    expect(() => loadConfig({ ...s3, [name]: value })).toThrow(message);
  });

  it.each([['S3_ENDPOINT'], ['S3_REGION'], ['S3_ACCESS_KEY_ID'], ['S3_SECRET_ACCESS_KEY']])(
    'refuses to start with a bucket but no %s',
    (name) => {
      expect(() => loadConfig({ ...s3, [name]: undefined })).toThrow(`${name} is required when STORAGE_URL is set`);
    },
  );
});
