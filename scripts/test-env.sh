# The tests' own ports, database and build folder, so npm test can run beside npm start. Sourced.
export NODE_ENV=production
export E2E_PORT=${E2E_PORT:-3100}
export PORT=$E2E_PORT
export DATABASE_URL=$(database_url brixhouse_test)
export SMTP_PORT=${TEST_SMTP_PORT:-1125}
export MAIL_WEB_PORT=${TEST_MAIL_WEB_PORT:-1180}
# The tests always use their own local object store.
export S3_PORT=${TEST_S3_PORT:-9300}
export S3_ENDPOINT=http://127.0.0.1:$S3_PORT
export S3_BUCKET=brixhouse-test
export APP_URL=http://127.0.0.1:$E2E_PORT
export NEXTAUTH_URL=$APP_URL
export NEXTAUTH_SECRET=brixhouse-test-secret-not-for-production
export NEXT_DIST_DIR=.next-test
payment_env "${TEST_PAY_PORT:-9500}"
