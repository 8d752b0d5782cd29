# The tests' own ports, database and build folder, so npm test can run beside npm start. Sourced
# after lib.sh (which sets this clone's ports). The database is always brixhouse_test, whatever
# DATABASE_URL the shell had, so no test run reaches the development database.
export NODE_ENV=production
export PORT=$E2E_PORT
export DATABASE_URL=$(database_url brixhouse_test)
export SMTP_PORT=$TEST_SMTP_PORT
export MAIL_WEB_PORT=$TEST_MAIL_WEB_PORT
# The tests always use their own local object store.
export S3_PORT=$TEST_S3_PORT
export S3_ENDPOINT=http://127.0.0.1:$S3_PORT
export S3_BUCKET=brixhouse-test
export APP_URL=http://127.0.0.1:$E2E_PORT
export NEXTAUTH_URL=$APP_URL
export NEXTAUTH_SECRET=$(secret_file "$DATA_DIR/test-nextauth-secret")
export NEXT_DIST_DIR=.next-test
payment_env "${TEST_PAY_PORT:-9500}"
# The health check says "test": the integration set-up reuses only a server that says so.
export BRIXHOUSE_TEST_SERVER=1
# Sign-in limits count failures over a short window here, so the tests can wait one out.
export SIGN_IN_WINDOW_SECONDS=${SIGN_IN_WINDOW_SECONDS:-30}
