# -Werror when FINESTRA_WERROR is on (CI); off by default so a newer compiler's new warning does not
# break a user's build.
function(finestra_apply_werror target)
  if(FINESTRA_WERROR)
    target_compile_options(${target} PRIVATE $<$<CXX_COMPILER_ID:GNU,Clang>:-Werror>)
  endif()
endfunction()

# Per-target warning and sanitizer settings, applied with finestra_set_options(target).
function(finestra_set_options target)
  target_compile_options(${target} PRIVATE
    $<$<CXX_COMPILER_ID:GNU,Clang>:-Wall -Wextra -Wpedantic -Wshadow -Wconversion -Wno-sign-conversion>)
  finestra_apply_werror(${target})
  if(FINESTRA_SANITIZE)
    target_compile_options(${target} PRIVATE -fsanitize=address,undefined -fno-omit-frame-pointer -fno-sanitize-recover=undefined)
    target_link_options(${target} PRIVATE -fsanitize=address,undefined)
  endif()
endfunction()

# Same, but for third-party-heavy code (tests, Qt moc output) where -Wconversion is noise.
function(finestra_set_relaxed_options target)
  target_compile_options(${target} PRIVATE $<$<CXX_COMPILER_ID:GNU,Clang>:-Wall -Wextra>)
  finestra_apply_werror(${target})
  if(FINESTRA_SANITIZE)
    target_compile_options(${target} PRIVATE -fsanitize=address,undefined -fno-omit-frame-pointer -fno-sanitize-recover=undefined)
    target_link_options(${target} PRIVATE -fsanitize=address,undefined)
  endif()
endfunction()
